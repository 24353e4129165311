using System.Net;
using System.Net.Http.Headers;
using System.Text.RegularExpressions;
using EventReview.Data;
using EventReview.Data.Auth;
using EventReview.Web.Demo;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Fixtures;

/// <summary>
/// The real app over a real SQLite file in a temp folder of its own (one per test class), started in Development
/// with the demo seeded: the invented network, the four demo accounts and three cases. Gives ready HTTP clients per
/// role: cookie sign-in through the real form (with antiforgery) and an API token made through <see cref="AccountAdmin"/>.
/// </summary>
public partial class EventReviewFactory : WebApplicationFactory<Program>, IAsyncLifetime
{
    /// <summary>The small upload limit configured for tests (bytes).</summary>
    public const long MaxUploadBytes = 64 * 1024;

    private readonly Dictionary<string, HttpClient> _clients = new(StringComparer.Ordinal);
    private readonly SemaphoreSlim _lock = new(1, 1);

    public EventReviewFactory()
    {
        DataDirectory = Path.Combine(Path.GetTempPath(), $"er-web-{Guid.NewGuid():N}");
        Directory.CreateDirectory(DataDirectory);
    }

    public string DataDirectory { get; }

    public string AttachmentDirectory => Path.Combine(DataDirectory, "attachments");

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment("Development");
        builder.UseSetting("EventReview:DataDirectory", DataDirectory);
        builder.UseSetting("EventReview:SeedDemo", "true");
        builder.UseSetting("EventReview:MaxUploadBytes", MaxUploadBytes.ToString(System.Globalization.CultureInfo.InvariantCulture));

        // Every in-memory request comes from the same (unknown) address: the sign-in limit is tested with its own host.
        builder.UseSetting("EventReview:RateLimits:SignInPerMinute", "10000");
        builder.UseSetting("EventReview:RateLimits:AddressPerMinute", "100000");
    }

    Task IAsyncLifetime.InitializeAsync() => StartAsync();

    Task IAsyncLifetime.DisposeAsync() => StopAsync();

    /// <summary>Starts the app (migrate and seed) once, before the first test; subclasses start what it needs first.</summary>
    protected virtual Task StartAsync()
    {
        _ = Server;
        return Task.CompletedTask;
    }

    /// <summary>Stops the app and deletes its data folder.</summary>
    protected virtual async Task StopAsync()
    {
        foreach (var c in _clients.Values)
        {
            c.Dispose();
        }

        await base.DisposeAsync();
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        try
        {
            Directory.Delete(DataDirectory, recursive: true);
        }
        catch (IOException)
        {
        }
    }

    /// <summary>The origin of the in-memory server, as a browser on its pages would send it in an Origin header.</summary>
    public const string OwnOrigin = "http://localhost";

    /// <summary>A client that follows no redirects and keeps no identity.</summary>
    public HttpClient Anonymous() => CreateClient(new WebApplicationFactoryClientOptions { AllowAutoRedirect = false, HandleCookies = true });

    /// <summary>A signed-in client for "observer", "reviewer" (demo reviewer A), "reviewer-b", "coordinator" or "token".</summary>
    public async Task<HttpClient> As(string who)
    {
        await _lock.WaitAsync();
        try
        {
            if (!_clients.TryGetValue(who, out var client))
            {
                client = who switch
                {
                    Who.Token => await TokenClientAsync("test token (all scopes)", TokenScopes.All),
                    Who.TokenRead => await TokenClientAsync("test token (read)", [TokenScopes.CasesRead]),
                    Who.TokenOpen => await TokenClientAsync("test token (open)", [TokenScopes.CasesOpen]),
                    Who.TokenEvidence => await TokenClientAsync("test token (evidence)", [TokenScopes.EvidenceAdd]),
                    Who.TokenPipeline => await TokenClientAsync("test token (pipeline)", null),
                    Who.TokenExpired => await ExpiredTokenClientAsync("test token (expired)"),
                    Who.TokenRevoked => await RevokedTokenClientAsync("test token (revoked)"),
                    Who.Anonymous => Anonymous(),
                    _ => await SignedInClientAsync(AccountFor(who)),
                };
                _clients[who] = client;
            }

            return client;
        }
        finally
        {
            _lock.Release();
        }
    }

    /// <summary>The demo account for a role name used in tests.</summary>
    public static DemoAccounts.Account AccountFor(string who) => who switch
    {
        Who.Observer => DemoAccounts.All.Single(a => a.Role == Roles.Observer),
        Who.Reviewer => DemoAccounts.All.Single(a => a.DisplayName == "Demo Reviewer A"),
        Who.ReviewerB => DemoAccounts.All.Single(a => a.DisplayName == "Demo Reviewer B"),
        Who.Coordinator => DemoAccounts.All.Single(a => a.Role == Roles.Coordinator),
        _ => throw new ArgumentOutOfRangeException(nameof(who), who, "not a person"),
    };

    /// <summary>The antiforgery token of the form on <paramref name="page"/> (the client keeps the matching cookie).</summary>
    public static async Task<string> AntiforgeryTokenAsync(HttpClient client, string page = "/signin")
    {
        var html = await client.GetStringAsync(page);
        return AntiforgeryTokenIn(html) ?? throw new InvalidOperationException($"{page} has no __RequestVerificationToken input.");
    }

    /// <summary>The antiforgery token of the form in a page's HTML, or null when it has none.</summary>
    public static string? AntiforgeryTokenIn(string html)
    {
        var token = AntiforgeryInput().Match(html);
        return token.Success ? WebUtility.HtmlDecode(token.Groups["value"].Value) : null;
    }

    /// <summary>Posts the sign-in form as a browser would (with the antiforgery token) and returns the raw answer.</summary>
    public static async Task<HttpResponseMessage> PostSignInAsync(HttpClient client, string email, string password) =>
        await client.PostAsync("/account/signin", new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["__RequestVerificationToken"] = await AntiforgeryTokenAsync(client),
            ["email"] = email,
            ["password"] = password,
            ["returnUrl"] = "/cases",
        }));

    /// <summary>Signs in through GET /signin and POST /account/signin with the antiforgery token; returns the client with the auth cookie.</summary>
    public async Task<HttpClient> SignedInClientAsync(DemoAccounts.Account account)
    {
        var client = Anonymous();
        var form = await client.GetStringAsync("/signin");
        var token = AntiforgeryInput().Match(form);
        if (!token.Success)
        {
            throw new InvalidOperationException("The sign-in page has no __RequestVerificationToken input.");
        }

        using var post = await client.PostAsync("/account/signin", new FormUrlEncodedContent(new Dictionary<string, string>
        {
            ["__RequestVerificationToken"] = WebUtility.HtmlDecode(token.Groups["value"].Value),
            ["email"] = account.Email,
            ["password"] = account.Password,
            ["returnUrl"] = "/cases",
        }));
        if (post.StatusCode != HttpStatusCode.Redirect || post.Headers.Location?.OriginalString != "/cases")
        {
            throw new InvalidOperationException($"Sign-in as {account.Email} failed: {(int)post.StatusCode} to {post.Headers.Location}.");
        }

        // A browser names the page's origin on every write; the app refuses cookie writes from other origins.
        client.DefaultRequestHeaders.Add("Origin", OwnOrigin);
        return client;
    }

    /// <summary>
    /// Creates an API token the way the tokens page and CLI do, and a client that sends it as a bearer token. Scopes
    /// default to every scope here (tests read back what they wrote); pass null for the pipeline default.
    /// </summary>
    public async Task<HttpClient> TokenClientAsync(string name = "test pipeline") => await TokenClientAsync(name, TokenScopes.All);

    /// <inheritdoc cref="TokenClientAsync(string)"/>
    public async Task<HttpClient> TokenClientAsync(string name, IEnumerable<string>? scopes, int? lifetimeDays = null)
    {
        using var scope = Services.CreateScope();
        var (_, secret) = await scope.ServiceProvider.GetRequiredService<AccountAdmin>().CreateTokenAsync(name, "tests", scopes, lifetimeDays);
        return BearerClient(secret);
    }

    /// <summary>A client with a token (every scope) created ten days ago for one day (so it expired nine days ago).</summary>
    public async Task<HttpClient> ExpiredTokenClientAsync(string name)
    {
        var (token, secret) = ApiToken.Create(name, "tests", DateTimeOffset.UtcNow.AddDays(-10), TokenScopes.All, 1);
        await using var db = Db();
        db.ApiTokens.Add(token);
        await db.SaveChangesAsync();
        return BearerClient(secret);
    }

    /// <summary>A client with a token (every scope) that was revoked.</summary>
    public async Task<HttpClient> RevokedTokenClientAsync(string name)
    {
        using var scope = Services.CreateScope();
        var admin = scope.ServiceProvider.GetRequiredService<AccountAdmin>();
        var (token, secret) = await admin.CreateTokenAsync(name, "tests", TokenScopes.All);
        await admin.RevokeTokenAsync(token.Id, "tests");
        return BearerClient(secret);
    }

    /// <summary>A client that sends <paramref name="secret"/> as its bearer token.</summary>
    public HttpClient BearerClient(string secret)
    {
        var client = Anonymous();
        client.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", secret);
        return client;
    }

    /// <summary>A fresh context on the app's database, for checking what was stored.</summary>
    public AppDbContext Db() => Services.GetRequiredService<AppDbContextFactory>().CreateDbContext();

    [GeneratedRegex("<input[^>]*name=\"__RequestVerificationToken\"[^>]*value=\"(?<value>[^\"]+)\"", RegexOptions.IgnoreCase)]
    private static partial Regex AntiforgeryInput();
}
