using EventReview.Data;
using EventReview.Web;
using EventReview.Web.Api;
using EventReview.Web.Components;
using EventReview.Web.Demo;
using EventReview.Web.Operations;
using EventReview.Web.Security;
using EventReview.Web.Services;
using Microsoft.Extensions.Options;

// The app's own folder holds appsettings.json, wwwroot and the checklists: use it as the content root when the app is
// started from elsewhere (e.g. `dotnet /opt/eventreview/EventReview.Web.dll`), so settings are never silently missing.
var contentRoot = File.Exists(Path.Combine(Directory.GetCurrentDirectory(), "appsettings.json")) ? null : AppContext.BaseDirectory;
var builder = WebApplication.CreateBuilder(new WebApplicationOptions { Args = args, ContentRootPath = contentRoot });
builder.WebHost.UseStaticWebAssets();
builder.AddEventReviewOperations();
builder.AddEventReviewTelemetry();
builder.Services.AddEventReviewWeb(builder.Configuration);
var seedDemo = builder.Configuration.GetValue<bool?>("EventReview:SeedDemo") ?? builder.Environment.IsDevelopment();
builder.Services.AddSingleton(new DemoMode(seedDemo));
var maxUpload = builder.Configuration.GetValue<long?>("EventReview:MaxUploadBytes") ?? 200L * 1024 * 1024;
builder.WebHost.ConfigureKestrel(k => k.Limits.MaxRequestBodySize = maxUpload + (1024 * 1024));
builder.Services.Configure<Microsoft.AspNetCore.Http.Features.FormOptions>(o => o.MultipartBodyLengthLimit = maxUpload + (1024 * 1024));

var app = builder.Build();

// The build writes docs/openapi.json by starting this host without a server (GetDocument.Insider): it must not touch a
// database or files then, only map the endpoints.
var generatingDocument = System.Reflection.Assembly.GetEntryAssembly()?.GetName().Name == "GetDocument.Insider";
if (!generatingDocument)
{
    await PrepareAsync(app, seedDemo);
}

// Security headers first, so that every answer carries them (the "HTTPS needed" page and error answers too).
app.UseEventReviewSecurityHeaders();
app.UseEventReviewOperations();
app.UseMetricsAccess();
if (!app.Environment.IsDevelopment())
{
    app.UseExceptionHandler("/error", createScopeForErrors: true);
}

app.UseApiProblems();
app.UseWhen(ctx => !ApiProblems.IsProblemPath(ctx.Request.Path),
    branch => branch.UseStatusCodePagesWithReExecute("/not-found", createScopeForStatusCodePages: true));
app.UseAuthentication();
app.UseCrossSiteRequestGuard();
app.UseRateLimiter();
app.UseAuthorization();
app.UseAntiforgery();

app.MapStaticAssets().AllowAnonymous();
app.MapHealth();
app.MapMetrics();
app.MapOpenApi().AllowAnonymous().RequireRateLimiting(ApiRateLimitPolicy.Name);
app.MapApiReference();
app.MapEventReviewApi();
app.MapRecordKeyApi();
app.MapAccountEndpoints();
app.MapSingleSignOnEndpoints();
app.MapRazorComponents<App>()
    .AddInteractiveServerRenderMode();

app.Lifetime.ApplicationStarted.Register(() =>
{
    if (generatingDocument)
    {
        return; // no server, so no addresses
    }

    var log = app.Services.GetRequiredService<ILoggerFactory>().CreateLogger("EventReview");
    foreach (var url in app.Urls)
    {
        log.LogInformation("EventReview is running at {Url}{Demo}", url, seedDemo ? " (demo data; accounts listed on the sign-in page)" : string.Empty);
    }
});

app.Run();

static async Task PrepareAsync(WebApplication app, bool seedDemo)
{
    await DatabaseInitializer.MigrateAsync(app.Services.GetRequiredService<AppDbContextFactory>());
    await EventReview.Data.Records.RecordKeyStartup.EnsureSigningKeyAsync(app.Services.GetRequiredService<AppDbContextFactory>(), TimeProvider.System);
    using (var scope = app.Services.CreateScope())
    {
        await scope.ServiceProvider.GetRequiredService<EventReview.Data.Auth.AccountAdmin>().EnsureRolesAsync();
        if (seedDemo)
        {
            await scope.ServiceProvider.GetRequiredService<DemoSeeder>().SeedIfEmptyAsync();
        }
    }

    var orphans = app.Services.GetRequiredService<AttachmentStore>().RemoveOrphanedUploads();
    if (orphans.Count > 0)
    {
        app.Services.GetRequiredService<ILoggerFactory>().CreateLogger("EventReview").LogWarning(
            "Removed {Count} unfinished upload file(s) left by an earlier run: {Files}", orphans.Count, string.Join(", ", orphans));
    }
}

/// <summary>Entry point marker for WebApplicationFactory.</summary>
public partial class Program;
