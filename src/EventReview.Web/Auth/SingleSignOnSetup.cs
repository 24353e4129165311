using System.Security.Claims;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Authentication.Cookies;
using Microsoft.AspNetCore.Authentication.OpenIdConnect;
using Microsoft.AspNetCore.Identity;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Auth;

/// <summary>
/// The ways in (<see cref="SignInSettings"/>): local accounts and single sign-on at an OpenID Connect provider
/// (authorization code flow with PKCE; the provider's answer lands in Identity's external cookie and
/// <c>/account/sso/done</c> turns it into an account). Wrong settings stop the start with a message naming each one.
/// </summary>
public static class SingleSignOnSetup
{
    private static readonly string[] BaseScopes = ["openid", "profile", "email"];

    /// <summary>Properties item saying why the provider was asked: <see cref="ForSignIn"/> or <see cref="ForSignature"/>.</summary>
    public const string PurposeKey = "eventreview:purpose";

    public const string ForSignIn = "signin";

    public const string ForSignature = "signature";

    /// <summary>Properties item holding the signature request id while the signer is at the provider.</summary>
    public const string SignatureRequestKey = "eventreview:signature-request";

    /// <summary>Properties item holding the e-mail to suggest at the provider's sign-in form.</summary>
    public const string LoginHintKey = "eventreview:login-hint";

    /// <summary>Claim on the cookie of a person who signed in at the identity provider (value <see cref="SingleSignOnValue"/>).</summary>
    public const string SignedInWithClaim = "eventreview:signed_in_with";

    public const string SingleSignOnValue = "sso";

    /// <summary>True when this person's session began at the identity provider.</summary>
    public static bool SignedInWithSingleSignOn(this ClaimsPrincipal user) => user.HasClaim(SignedInWithClaim, SingleSignOnValue);

    /// <summary>Binds and checks the sign-in settings and adds the OpenID Connect handler when single sign-on is set up.</summary>
    /// <exception cref="InvalidOperationException">When a setting is wrong; the message names every wrong setting.</exception>
    public static void AddEventReviewSignIn(this AuthenticationBuilder auth, IConfiguration configuration)
    {
        var services = auth.Services;
        var settings = configuration.GetSection(SignInSettings.Section).Get<SignInSettings>() ?? new SignInSettings();
        var problems = settings.Problems();
        if (problems.Count > 0)
        {
            throw new InvalidOperationException("EventReview cannot start: the sign-in settings are wrong.\n - " + string.Join("\n - ", problems)
                + "\nSee docs/operations.md, \"Single sign-on\".");
        }

        services.Configure<SignInSettings>(configuration.GetSection(SignInSettings.Section));
        services.AddScoped<SingleSignOnAccounts>();
        services.AddScoped<ReauthenticatedSigning>();
        services.Configure<SecurityStampValidatorOptions>(o => o.OnRefreshingPrincipal = KeepSignInMethod);
        services.PostConfigure<CookieAuthenticationOptions>(IdentityConstants.ApplicationScheme, o =>
        {
            // With local accounts switched off, a session that began with a password ends at its next request.
            var validate = o.Events.OnValidatePrincipal;
            o.Events.OnValidatePrincipal = async ctx =>
            {
                await validate(ctx);
                if (ctx.Principal is { } p && !p.SignedInWithSingleSignOn()
                    && !ctx.HttpContext.RequestServices.GetRequiredService<IOptions<SignInSettings>>().Value.LocalAccounts)
                {
                    ctx.RejectPrincipal();
                }
            };
        });

        if (!settings.SingleSignOn.Enabled)
        {
            return;
        }

        var sso = settings.SingleSignOn;
        auth.AddOpenIdConnect(SingleSignOnAccounts.Provider, sso.DisplayName, o =>
        {
            o.Authority = sso.Authority!.Trim();
            o.ClientId = sso.ClientId;
            o.ClientSecret = sso.ClientSecret;
            o.RequireHttpsMetadata = sso.RequireHttps;
            o.ResponseType = "code";
            o.UsePkce = true;

            // The code comes back in the query of a top-level GET, so the state cookies can stay SameSite=Lax.
            o.ResponseMode = "query";
            o.SignInScheme = IdentityConstants.ExternalScheme;
            o.CallbackPath = "/signin-oidc";
            o.MapInboundClaims = false;
            o.SaveTokens = false;
            o.GetClaimsFromUserInfoEndpoint = false;
            o.BackchannelTimeout = TimeSpan.FromSeconds(15);
            o.Scope.Clear();
            foreach (var scope in BaseScopes.Concat((sso.Scopes ?? string.Empty).Split(' ', StringSplitOptions.RemoveEmptyEntries)).Distinct())
            {
                o.Scope.Add(scope);
            }

            o.CorrelationCookie.SameSite = SameSiteMode.Lax;
            o.NonceCookie.SameSite = SameSiteMode.Lax;
            o.CorrelationCookie.SecurePolicy = CookieSecurePolicy.SameAsRequest;
            o.NonceCookie.SecurePolicy = CookieSecurePolicy.SameAsRequest;
            o.Events.OnRedirectToIdentityProvider = AskForFreshSignInWhenSigning;
            o.Events.OnRemoteFailure = ReportRemoteFailure;
        });
    }

    /// <summary>
    /// Signing needs the person to enter their credentials again now: <c>prompt=login</c> and <c>max_age=0</c>
    /// (OpenID Connect Core 1.0, section 3.1.2.1), which also makes the provider return <c>auth_time</c>.
    /// </summary>
    private static Task AskForFreshSignInWhenSigning(RedirectContext ctx)
    {
        if (ctx.Properties.Items.TryGetValue(PurposeKey, out var purpose) && purpose == ForSignature)
        {
            ctx.ProtocolMessage.Prompt = "login";
            ctx.ProtocolMessage.MaxAge = "0";
        }

        if (ctx.Properties.Items.TryGetValue(LoginHintKey, out var hint) && !string.IsNullOrEmpty(hint))
        {
            ctx.ProtocolMessage.LoginHint = hint;
        }

        return Task.CompletedTask;
    }

    /// <summary>The provider refused, the person cancelled, or the provider failed mid-way: say so on a page, never a stack trace.</summary>
    private static Task ReportRemoteFailure(RemoteFailureContext ctx)
    {
        var log = ctx.HttpContext.RequestServices.GetRequiredService<ILoggerFactory>().CreateLogger("EventReview.SingleSignOn");
        log.LogWarning("Single sign-on did not complete: {Reason}", ctx.Failure?.Message);
        if (ctx.Properties?.Items.TryGetValue(SignatureRequestKey, out var id) == true && !string.IsNullOrEmpty(id))
        {
            ctx.Response.Redirect($"/account/sso/sign/{Uri.EscapeDataString(id)}/done?failed=1");
        }
        else
        {
            ctx.Response.Redirect("/signin?error=sso-failed");
        }

        ctx.HandleResponse();
        return Task.CompletedTask;
    }

    /// <summary>Keeps the sign-in method on the cookie when Identity refreshes the principal (security stamp check).</summary>
    private static Task KeepSignInMethod(SecurityStampRefreshingPrincipalContext ctx)
    {
        if (ctx.CurrentPrincipal?.SignedInWithSingleSignOn() == true && ctx.NewPrincipal?.Identity is ClaimsIdentity identity)
        {
            identity.AddClaim(new Claim(SignedInWithClaim, SingleSignOnValue));
        }

        return Task.CompletedTask;
    }

    /// <summary>
    /// True when the provider's discovery document can be read now (the handler's copy, and one request to the provider
    /// itself). Asked before sending a person there, so that a provider that is down gives a page saying so instead of
    /// the browser's connection error.
    /// </summary>
    public static async Task<bool> ProviderAnswersAsync(HttpContext http)
    {
        var options = http.RequestServices.GetRequiredService<IOptionsMonitor<OpenIdConnectOptions>>().Get(SingleSignOnAccounts.Provider);
        if (options.ConfigurationManager is null)
        {
            return false;
        }

        using var timeout = CancellationTokenSource.CreateLinkedTokenSource(http.RequestAborted);
        timeout.CancelAfter(TimeSpan.FromSeconds(15));
        try
        {
            await options.ConfigurationManager.GetConfigurationAsync(timeout.Token);

            // The handler keeps the document for hours: ask the provider itself whether it answers now.
            using var probe = new HttpRequestMessage(HttpMethod.Get, options.MetadataAddress);
            using var answer = await options.Backchannel.SendAsync(probe, HttpCompletionOption.ResponseHeadersRead, timeout.Token);
            answer.EnsureSuccessStatusCode();
            return true;
        }
        catch (Exception ex) when (ex is InvalidOperationException or HttpRequestException or IOException or OperationCanceledException)
        {
            http.RequestServices.GetRequiredService<ILoggerFactory>().CreateLogger("EventReview.SingleSignOn")
                .LogWarning("The identity provider at {Authority} did not answer: {Reason}", options.Authority, ex.Message);
            return false;
        }
    }
}
