using EventReview.Data;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Demo;
using EventReview.Web.Security;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Identity;
using MudBlazor.Services;

namespace EventReview.Web;

public static class WebServiceCollectionExtensions
{
    /// <summary>Everything the web app needs: data, identity with cookie and token sign-in, services, UI.</summary>
    public static IServiceCollection AddEventReviewWeb(this IServiceCollection services, IConfiguration configuration)
    {
        services.Configure<EventReviewOptions>(configuration.GetSection(EventReviewOptions.Section));
        var options = configuration.GetSection(EventReviewOptions.Section).Get<EventReviewOptions>() ?? new EventReviewOptions();
        var settings = DatabaseSettings.From(configuration["Database:Provider"], configuration.GetConnectionString("Default"), options.DataDirectory);
        var records = Data.Records.RecordSettings.From(configuration["EventReview:Records:KeyDirectory"], configuration["EventReview:Records:WitnessDirectory"],
            configuration["EventReview:Records:WitnessUrl"], settings.DataDirectory);
        services.AddEventReviewData(settings, Data.Records.RecordKeeping.Open(records));
        services.AddSingleton(TimeProvider.System);

        services.AddEventReviewIdentityCore()
            .AddSignInManager()
            .AddClaimsPrincipalFactory<AppClaimsFactory>()
            .AddDefaultTokenProviders();

        var authentication = services.AddAuthentication(o =>
            {
                o.DefaultScheme = "smart";
                o.DefaultChallengeScheme = "smart";
            })
            .AddPolicyScheme("smart", "cookie or token", o => o.ForwardDefaultSelector = ctx =>
                ctx.Request.Headers.Authorization.ToString().StartsWith("Bearer ", StringComparison.OrdinalIgnoreCase)
                    ? ApiTokenAuthenticationHandler.SchemeName
                    : IdentityConstants.ApplicationScheme)
            .AddScheme<AuthenticationSchemeOptions, ApiTokenAuthenticationHandler>(ApiTokenAuthenticationHandler.SchemeName, null);
        authentication.AddIdentityCookies();
        authentication.AddEventReviewSignIn(configuration);
        services.ConfigureApplicationCookie(o =>
        {
            o.LoginPath = "/signin";
            o.AccessDeniedPath = "/denied";
            o.Cookie.Name = "eventreview.auth";
            o.ExpireTimeSpan = TimeSpan.FromHours(12);
            o.SlidingExpiration = true;
            o.Events.OnRedirectToLogin = ctx => ApiAware(ctx, StatusCodes.Status401Unauthorized);
            o.Events.OnRedirectToAccessDenied = ctx => ApiAware(ctx, StatusCodes.Status403Forbidden);
        });
        services.AddAuthorization(Policies.Configure);
        services.AddEventReviewSecurity(configuration);
        services.AddCascadingAuthenticationState();

        Notifications.NotificationServiceCollectionExtensions.AddEventReviewNotifications(services, configuration);
        Services.Live.LiveServiceCollectionExtensions.AddEventReviewLive(services, configuration, settings);
        services.AddSingleton<ApiTokenCache>();
        services.AddSingleton<TemplateCatalog>();
        services.AddSingleton<MarkdownRenderer>();
        services.AddSingleton<KnownItems>();
        services.AddScoped<CaseWriter>();
        services.AddScoped<CaseQueries>();
        services.AddScoped<EvidenceAppender>();
        services.AddScoped<SignerCheck>();
        services.AddScoped<CaseWorkflow>();
        services.AddScoped<NetworkService>();
        services.AddSingleton<Services.Checks.CheckRunners>();
        services.AddScoped<Services.Checks.TimingCheckService>();
        services.AddSingleton<Services.Checks.CheckJobs>();
        services.AddScoped<Services.Checks.ConfigurationService>();
        services.AddScoped<EventReview.Dossier.CaseDossierService>();
        services.AddSingleton<Services.Checks.CaseFiles>();
        services.AddCheckView<Components.Checks.TimingRunner, Components.Checks.TimingResultView>(Core.Checklists.CheckKind.Timing);
        services.AddScoped<Services.Checks.OverlapCheckService>();
        services.AddCheckView<Components.Checks.OverlapRunner, Components.Checks.OverlapResultView>(Core.Checklists.CheckKind.Overlap);
        services.AddScoped<IDemoSeedStep, OverlapDemoStep>();
        services.AddScoped<DemoSeeder>();
        services.AddScoped<Services.Checks.EnvironmentCheckService>();
        services.AddScoped<Services.Checks.InjectionCheckService>();
        services.AddScoped<Services.Checks.SealedRecordService>();
        services.AddScoped<Services.Checks.ChainCheckService>();
        services.AddCheckView<Components.Checks.EnvironmentRunner, Components.Checks.EnvironmentResultView>(Core.Checklists.CheckKind.Environment);
        services.AddCheckView<Components.Checks.InjectionsRunner, Components.Checks.InjectionsResultView>(Core.Checklists.CheckKind.Injections);
        services.AddCheckView<Components.Checks.ChainRunner, Components.Checks.ChainResultView>(Core.Checklists.CheckKind.Chain);
        services.AddScoped<IDemoSeedStep, LocalCausesDemoStep>();
        services.AddScoped<Services.Checks.BackgroundCheckService>();
        services.AddCheckView<Components.Checks.BackgroundRunner, Components.Checks.BackgroundResultView>(Core.Checklists.CheckKind.Background);
        services.AddScoped<IDemoSeedStep, BackgroundDemoStep>();
        services.AddScoped<IDemoSeedStep, TimingDemoStep>();
        services.AddScoped<IDemoSeedStep, FreezeDemoStep>();

        services.AddRazorComponents().AddInteractiveServerComponents();
        services.AddMudServices();
        Api.ApiDocumentation.AddEventReviewOpenApi(services);
        services.AddProblemDetails();

        // A query or route value of the wrong type throws (instead of an empty 400), so the problem answer can name it.
        services.Configure<Microsoft.AspNetCore.Routing.RouteHandlerOptions>(o => o.ThrowOnBadRequest = true);
        services.ConfigureHttpJsonOptions(o => o.SerializerOptions.NumberHandling = System.Text.Json.Serialization.JsonNumberHandling.Strict);
        return services;
    }

    private static Task ApiAware(Microsoft.AspNetCore.Authentication.RedirectContext<Microsoft.AspNetCore.Authentication.Cookies.CookieAuthenticationOptions> ctx, int status)
    {
        // Machine clients (the API and its OpenAPI document) get a status code, never a redirect to the sign-in page.
        if (ctx.Request.Path.StartsWithSegments("/api") || ctx.Request.Path.StartsWithSegments("/openapi"))
        {
            ctx.Response.StatusCode = status;
            return Task.CompletedTask;
        }

        ctx.Response.Redirect(ctx.RedirectUri);
        return Task.CompletedTask;
    }
}
