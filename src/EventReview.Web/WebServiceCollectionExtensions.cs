using EventReview.Data;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Demo;
using EventReview.Web.Security;
using EventReview.Web.Services;
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
        services.AddScoped<Services.Checks.TimingCheckService>();
        services.AddSingleton<Services.Checks.CheckJobs>();
        services.AddScoped<Services.Checks.ConfigurationService>();
        services.AddScoped<EventReview.Dossier.CaseDossierService>();
        services.AddSingleton<Services.Checks.CaseFiles>();
        Services.Checks.CheckRunners.Register(Core.Checklists.CheckKind.Timing, typeof(Components.Checks.TimingRunner));
        Services.Checks.CheckRunners.RegisterResultView(Core.Checklists.CheckKind.Timing, typeof(Components.Checks.TimingResultView));
        services.AddScoped<Services.Checks.OverlapCheckService>();
        Services.Checks.CheckRunners.Register(Core.Checklists.CheckKind.Overlap, typeof(Components.Checks.OverlapRunner));
        Services.Checks.CheckRunners.RegisterResultView(Core.Checklists.CheckKind.Overlap, typeof(Components.Checks.OverlapResultView));
        services.AddScoped<IDemoSeedStep, OverlapDemoStep>();
        services.AddScoped<DemoSeeder>();
        services.AddScoped<Services.Checks.EnvironmentCheckService>();
        services.AddScoped<Services.Checks.InjectionCheckService>();
        services.AddScoped<Services.Checks.SealedRecordService>();
        services.AddScoped<Services.Checks.ChainCheckService>();
        Services.Checks.CheckRunners.Register(Core.Checklists.CheckKind.Environment, typeof(Components.Checks.EnvironmentRunner));
        Services.Checks.CheckRunners.RegisterResultView(Core.Checklists.CheckKind.Environment, typeof(Components.Checks.EnvironmentResultView));
        Services.Checks.CheckRunners.Register(Core.Checklists.CheckKind.Injections, typeof(Components.Checks.InjectionsRunner));
        Services.Checks.CheckRunners.RegisterResultView(Core.Checklists.CheckKind.Injections, typeof(Components.Checks.InjectionsResultView));
        Services.Checks.CheckRunners.Register(Core.Checklists.CheckKind.Chain, typeof(Components.Checks.ChainRunner));
        Services.Checks.CheckRunners.RegisterResultView(Core.Checklists.CheckKind.Chain, typeof(Components.Checks.ChainResultView));
        services.AddScoped<IDemoSeedStep, LocalCausesDemoStep>();
        services.AddScoped<Services.Checks.BackgroundCheckService>();
        Services.Checks.CheckRunners.Register(Core.Checklists.CheckKind.Background, typeof(Components.Checks.BackgroundRunner));
        Services.Checks.CheckRunners.RegisterResultView(Core.Checklists.CheckKind.Background, typeof(Components.Checks.BackgroundResultView));
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
