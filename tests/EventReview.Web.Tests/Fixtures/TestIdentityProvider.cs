using System.Collections.Concurrent;
using System.Collections.Immutable;
using System.Globalization;
using System.Net;
using System.Net.Sockets;
using System.Security.Claims;
using Microsoft.AspNetCore;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Authentication.Cookies;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Logging;
using Microsoft.IdentityModel.Tokens;
using OpenIddict.Abstractions;
using OpenIddict.Server.AspNetCore;
using static OpenIddict.Abstractions.OpenIddictConstants;
using static OpenIddict.Server.OpenIddictServerEvents;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>
/// An OpenID Connect provider for tests, started in this process on a free local port from OpenIddict (a general-purpose
/// open-source server library): authorization code flow with PKCE, a plain login form, its own session cookie, and
/// the person's groups, e-mail and <c>auth_time</c> in the ID token. It honours <c>prompt=login</c> and <c>max_age</c>
/// unless <see cref="IgnoreLoginPrompt"/> is set (a provider that reuses the session anyway), and its clock can be
/// moved (<see cref="ClockOffset"/>) to make a session look old. One registered client: <see cref="ClientId"/>.
/// </summary>
public sealed class TestIdentityProvider : IAsyncDisposable
{
    public const string ClientId = "eventreview-tests";
    public const string ClientSecret = "test-client-secret-not-for-production";
    private const string Session = "idp-session";

    private readonly WebApplication _app;

    private TestIdentityProvider(WebApplication app, string baseUrl)
    {
        _app = app;
        BaseUrl = baseUrl;
    }

    /// <summary>The issuer, e.g. <c>http://127.0.0.1:40123/</c>.</summary>
    public string BaseUrl { get; }

    /// <summary>People who can sign in here, by user name.</summary>
    public ConcurrentDictionary<string, ProviderPerson> People { get; } = new(StringComparer.Ordinal);

    /// <summary>Completed logins (credentials entered) so far.</summary>
    public int Logins => _logins;

    /// <summary>Misbehave: keep an existing session even when asked for <c>prompt=login</c> or <c>max_age</c>.</summary>
    public bool IgnoreLoginPrompt { get; set; }

    /// <summary>Answer the next authorization requests with <c>access_denied</c> (the person cancelled at the provider).</summary>
    public bool Refuse { get; set; }

    /// <summary>Added to the real time when a login is recorded (negative: the session looks older).</summary>
    public TimeSpan ClockOffset { get; set; }

    private int _logins;

    /// <summary>Starts the provider for a client whose redirect address is <paramref name="redirectUri"/>.</summary>
    public static async Task<TestIdentityProvider> StartAsync(string redirectUri)
    {
        var port = FreePort();
        var baseUrl = $"http://127.0.0.1:{port}/";
        var builder = WebApplication.CreateSlimBuilder();
        builder.WebHost.UseUrls(baseUrl);
        builder.Logging.ClearProviders();
        builder.Services.AddAuthentication(Session).AddCookie(Session, o => o.Cookie.Name = "idp.session");
        builder.Services.AddOpenIddict().AddServer(o =>
        {
            o.SetIssuer(new Uri(baseUrl));
            o.SetAuthorizationEndpointUris("connect/authorize").SetTokenEndpointUris("connect/token");
            o.AllowAuthorizationCodeFlow().RequireProofKeyForCodeExchange();
            o.RegisterScopes(Scopes.Profile, Scopes.Email);
            o.AddEphemeralEncryptionKey().AddEphemeralSigningKey();
            o.DisableAccessTokenEncryption();
            o.EnableDegradedMode();
            o.UseAspNetCore().EnableAuthorizationEndpointPassthrough().DisableTransportSecurityRequirement();
            o.AddEventHandler<ValidateAuthorizationRequestContext>(h => h.UseInlineHandler(ctx =>
            {
                if (ctx.ClientId != ClientId)
                {
                    ctx.Reject(Errors.InvalidClient, "Unknown client.");
                }
                else if (ctx.RedirectUri != redirectUri)
                {
                    ctx.Reject(Errors.InvalidRequest, "Unregistered redirect_uri.");
                }

                return default;
            }));
            o.AddEventHandler<ValidateTokenRequestContext>(h => h.UseInlineHandler(ctx =>
            {
                if (ctx.ClientId != ClientId || ctx.ClientSecret != ClientSecret)
                {
                    ctx.Reject(Errors.InvalidClient, "Wrong client credentials.");
                }

                return default;
            }));
        });

        var app = builder.Build();
        var provider = new TestIdentityProvider(app, baseUrl);
        app.UseAuthentication();
        app.MapMethods("/connect/authorize", ["GET", "POST"], (Func<HttpContext, Task<IResult>>)provider.AuthorizeAsync);
        app.MapGet("/login", (string? returnUrl) => Results.Content(LoginForm(returnUrl ?? "/"), "text/html"));
        app.MapPost("/login", (Func<HttpContext, Task<IResult>>)provider.LoginAsync);
        await app.StartAsync();

        // Answer the discovery document and the keys once now, so that the first sign-in of a busy test run is not slow.
        using (var warm = new HttpClient { BaseAddress = new Uri(baseUrl), Timeout = TimeSpan.FromSeconds(60) })
        {
            (await warm.GetAsync(".well-known/openid-configuration")).EnsureSuccessStatusCode();
            (await warm.GetAsync(".well-known/jwks")).EnsureSuccessStatusCode();
        }

        return provider;
    }

    /// <summary>Adds or replaces a person.</summary>
    public ProviderPerson Add(string userName, string email, string name, params string[] groups)
    {
        var person = new ProviderPerson(userName, "pw-" + userName, "sub-" + Guid.NewGuid().ToString("N")[..12], email, name, groups, EmailVerified: true);
        People[userName] = person;
        return person;
    }

    /// <summary>Stops answering (a provider that is down); idempotent.</summary>
    public async Task StopAsync()
    {
        if (Interlocked.Exchange(ref _stopped, 1) == 0)
        {
            await _app.StopAsync();
            await _app.DisposeAsync();
        }
    }

    public async ValueTask DisposeAsync() => await StopAsync();

    private int _stopped;

    private async Task<IResult> AuthorizeAsync(HttpContext http)
    {
        var request = http.GetOpenIddictServerRequest() ?? throw new InvalidOperationException("Not an OpenID Connect request.");
        if (Refuse)
        {
            return Results.Forbid(new AuthenticationProperties(new Dictionary<string, string?>
            {
                [OpenIddictServerAspNetCoreConstants.Properties.Error] = Errors.AccessDenied,
                [OpenIddictServerAspNetCoreConstants.Properties.ErrorDescription] = "The person cancelled.",
            }), [OpenIddictServerAspNetCoreDefaults.AuthenticationScheme]);
        }

        var session = await http.AuthenticateAsync(Session);
        var justLoggedIn = http.Request.Query.ContainsKey("idp_login_done");
        var sessionAge = session.Succeeded ? DateTimeOffset.UtcNow - SessionTime(session.Principal!) : TimeSpan.MaxValue;
        var mustLogIn = !session.Succeeded || (!IgnoreLoginPrompt && !justLoggedIn &&
            (request.HasPromptValue(PromptValues.Login) || (request.MaxAge is { } max && sessionAge > TimeSpan.FromSeconds(max))));
        if (mustLogIn)
        {
            var back = http.Request.Path + http.Request.QueryString.Add("idp_login_done", "1");
            return Results.Redirect("/login?returnUrl=" + Uri.EscapeDataString(back));
        }

        var person = People[session.Principal!.Identity!.Name!];
        var identity = new ClaimsIdentity(TokenValidationParameters.DefaultAuthenticationType, Claims.Name, Claims.Role);
        identity.SetClaim(Claims.Subject, person.Subject).SetClaim(Claims.Email, person.Email).SetClaim(Claims.Name, person.Name);
        identity.AddClaim(new Claim("email_verified", person.EmailVerified ? "true" : "false", ClaimValueTypes.Boolean));
        identity.SetClaims("groups", [.. person.Groups]);
        identity.AddClaim(new Claim(Claims.AuthenticationTime, SessionTime(session.Principal).ToUnixTimeSeconds().ToString(CultureInfo.InvariantCulture), ClaimValueTypes.Integer64));
        identity.SetScopes(request.GetScopes());
        identity.SetDestinations(_ => [Destinations.IdentityToken]);
        return Results.SignIn(new ClaimsPrincipal(identity), authenticationScheme: OpenIddictServerAspNetCoreDefaults.AuthenticationScheme);
    }

    private async Task<IResult> LoginAsync(HttpContext http)
    {
        var form = await http.Request.ReadFormAsync();
        var returnUrl = form["returnUrl"].ToString();
        if (!People.TryGetValue(form["username"].ToString(), out var person) || person.Password != form["password"].ToString())
        {
            return Results.Content(LoginForm(returnUrl, "Wrong user name or password."), "text/html");
        }

        var at = DateTimeOffset.UtcNow + ClockOffset;
        var identity = new ClaimsIdentity([new Claim(ClaimTypes.Name, person.UserName), new Claim("login_at", at.ToUnixTimeSeconds().ToString(CultureInfo.InvariantCulture))], Session);
        await http.SignInAsync(Session, new ClaimsPrincipal(identity));
        Interlocked.Increment(ref _logins);
        return Results.Redirect(returnUrl.StartsWith('/') ? returnUrl : "/");
    }

    private static DateTimeOffset SessionTime(ClaimsPrincipal session) =>
        DateTimeOffset.FromUnixTimeSeconds(long.Parse(session.FindFirst("login_at")!.Value, CultureInfo.InvariantCulture));

    private static string LoginForm(string returnUrl, string? error = null) => $"""
        <!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><title>Test identity provider</title></head>
        <body style="font-family: sans-serif; max-width: 24rem; margin: 4rem auto">
        <h1>Test identity provider</h1>
        {(error is null ? string.Empty : $"<p role=\"alert\">{WebUtility.HtmlEncode(error)}</p>")}
        <form method="post" action="/login">
        <input type="hidden" name="returnUrl" value="{WebUtility.HtmlEncode(returnUrl)}" />
        <label>User name <input name="username" id="idp-username" /></label><br />
        <label>Password <input name="password" id="idp-password" type="password" /></label><br />
        <button type="submit" id="idp-submit">Sign in</button>
        </form></body></html>
        """;

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }
}

/// <summary>A person known to the <see cref="TestIdentityProvider"/>; their password is <c>pw-</c> + user name.</summary>
public sealed record ProviderPerson(string UserName, string Password, string Subject, string Email, string Name, IReadOnlyList<string> Groups, bool EmailVerified);
