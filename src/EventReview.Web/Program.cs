using EventReview.Data;
using EventReview.Web;
using EventReview.Web.Api;
using EventReview.Web.Components;
using EventReview.Web.Demo;
using EventReview.Web.Security;
using EventReview.Web.Services;
using Microsoft.Extensions.Options;

var builder = WebApplication.CreateBuilder(args);
builder.WebHost.UseStaticWebAssets();
builder.Services.AddEventReviewWeb(builder.Configuration);
var seedDemo = builder.Configuration.GetValue<bool?>("EventReview:SeedDemo") ?? builder.Environment.IsDevelopment();
builder.Services.AddSingleton(new DemoMode(seedDemo));
var maxUpload = builder.Configuration.GetValue<long?>("EventReview:MaxUploadBytes") ?? 200L * 1024 * 1024;
builder.WebHost.ConfigureKestrel(k => k.Limits.MaxRequestBodySize = maxUpload + (1024 * 1024));
builder.Services.Configure<Microsoft.AspNetCore.Http.Features.FormOptions>(o => o.MultipartBodyLengthLimit = maxUpload + (1024 * 1024));

var app = builder.Build();

await DatabaseInitializer.MigrateAsync(app.Services.GetRequiredService<AppDbContextFactory>());
using (var scope = app.Services.CreateScope())
{
    await scope.ServiceProvider.GetRequiredService<EventReview.Data.Auth.AccountAdmin>().EnsureRolesAsync();
    if (seedDemo)
    {
        await scope.ServiceProvider.GetRequiredService<DemoSeeder>().SeedIfEmptyAsync();
    }
}

app.UseEventReviewSecurityHeaders();
if (!app.Environment.IsDevelopment())
{
    app.UseExceptionHandler("/error", createScopeForErrors: true);
}

app.UseWhen(ctx => !ctx.Request.Path.StartsWithSegments("/api") && !ctx.Request.Path.StartsWithSegments("/openapi"),
    branch => branch.UseStatusCodePagesWithReExecute("/not-found", createScopeForStatusCodePages: true));
app.UseAuthentication();
app.UseRateLimiter();
app.UseAuthorization();
app.UseAntiforgery();

app.MapStaticAssets().AllowAnonymous();
app.MapOpenApi().RequireAuthorization(EventReview.Web.Auth.Policies.Read);
app.MapEventReviewApi();
app.MapAccountEndpoints();
app.MapRazorComponents<App>()
    .AddInteractiveServerRenderMode();

app.Lifetime.ApplicationStarted.Register(() =>
{
    foreach (var url in app.Urls)
    {
        Console.WriteLine($"EventReview is running at {url}" + (seedDemo ? " (demo data; accounts listed on the sign-in page)" : string.Empty));
    }
});

app.Run();

/// <summary>Entry point marker for WebApplicationFactory.</summary>
public partial class Program;
