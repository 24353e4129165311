using System.Net;
using System.Net.Sockets;
using EventReview.Data.Auth;
using EventReview.Web.Tests.Fixtures;
using Microsoft.AspNetCore.Hosting;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Tests.Auth;

/// <summary>
/// Single sign-on when things go wrong: a misconfigured provider stops the start with the setting named, a provider
/// that does not answer gives a page saying so while local accounts keep working, a refusal at the provider changes
/// nothing, and with local accounts switched off passwords open nothing.
/// </summary>
public sealed class SingleSignOnFailureTests
{
    [Theory]
    [InlineData("ClientSecret", "", "EventReview:SignIn:SingleSignOn:ClientSecret is empty")]
    [InlineData("ClientId", "", "EventReview:SignIn:SingleSignOn:ClientId is empty")]
    [InlineData("Authority", "login.example.org/realms/collab", "EventReview:SignIn:SingleSignOn:Authority 'login.example.org/realms/collab' is not an absolute http(s) address")]
    [InlineData("RoleMap:chair", "gw-chairs", "EventReview:SignIn:SingleSignOn:RoleMap:chair is not a role")]
    [InlineData("RequireHttps", "true", "is not https")]
    [InlineData("DefaultRole", "admin", "EventReview:SignIn:SingleSignOn:DefaultRole 'admin' is not a role")]
    public async Task A_misconfigured_provider_stops_the_start_with_a_message_naming_the_setting(string key, string value, string expected)
    {
        await using var factory = new ConfiguredFactory(new()
        {
            ["EventReview:SignIn:SingleSignOn:Authority"] = "http://127.0.0.1:9/",
            ["EventReview:SignIn:SingleSignOn:ClientId"] = "eventreview",
            ["EventReview:SignIn:SingleSignOn:ClientSecret"] = "secret",
            ["EventReview:SignIn:SingleSignOn:RequireHttps"] = "false",
            ["EventReview:SignIn:SingleSignOn:RoleMap:coordinator"] = "gw-review-coordinators",
            [$"EventReview:SignIn:SingleSignOn:{key}"] = value,
        });

        var ex = Assert.ThrowsAny<Exception>(() => factory.Server);

        Assert.Contains(expected, ex.ToString(), StringComparison.Ordinal);
        Assert.Contains("EventReview cannot start: the sign-in settings are wrong.", ex.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Switching_local_accounts_off_without_single_sign_on_stops_the_start()
    {
        await using var factory = new ConfiguredFactory(new() { ["EventReview:SignIn:LocalAccounts"] = "false" });

        var ex = Assert.ThrowsAny<Exception>(() => factory.Server);

        Assert.Contains("EventReview:SignIn:LocalAccounts is false but EventReview:SignIn:SingleSignOn:Authority is empty: nobody could sign in", ex.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_provider_that_does_not_answer_gives_a_clear_page_and_local_accounts_keep_working()
    {
        await using var factory = new SingleSignOnFactory { AuthorityOverride = $"http://127.0.0.1:{ClosedPort()}/" };
        await ((IAsyncLifetime)factory).InitializeAsync();
        using var browser = new SsoBrowser(factory, factory.Provider);

        var page = await browser.GoAsync("/account/sso?returnUrl=/network");

        Assert.Equal(HttpStatusCode.OK, page.StatusCode);
        Assert.Equal(("/signin", "sso-unavailable"), (browser.Location.AbsolutePath, browser.ErrorCode));
        var html = WebUtility.HtmlDecode(await page.Content.ReadAsStringAsync());
        Assert.Contains($"{SingleSignOnFactory.ProviderName} did not answer, so single sign-on cannot start right now", html, StringComparison.Ordinal);
        Assert.Contains("or sign in with a local account below", html, StringComparison.Ordinal);
        Assert.Contains("name=\"password\"", html, StringComparison.Ordinal);

        var local = await factory.SignedInClientAsync(EventReviewFactory.AccountFor(Who.Coordinator));
        Assert.Equal(HttpStatusCode.OK, (await local.GetAsync("/api/cases")).StatusCode);
        await ((IAsyncLifetime)factory).DisposeAsync();
    }

    [Fact]
    public async Task A_provider_that_goes_down_after_answering_once_still_gives_the_page_not_a_broken_redirect()
    {
        await using var factory = new SingleSignOnFactory();
        await ((IAsyncLifetime)factory).InitializeAsync();
        var person = factory.Provider.Add("early", "early@collab.example.org", "Early", "gw-reviewers");
        using (var first = new SsoBrowser(factory, factory.Provider))
        {
            await first.SignInAsync(person);
            Assert.Equal("/cases", first.Location.AbsolutePath); // the app now holds the provider's discovery document
        }

        await factory.Provider.StopAsync();
        using var browser = new SsoBrowser(factory, factory.Provider);
        await browser.GoAsync("/account/sso");

        Assert.Equal(("/signin", "sso-unavailable"), (browser.Location.AbsolutePath, browser.ErrorCode));
        await ((IAsyncLifetime)factory).DisposeAsync();
    }

    [Fact]
    public async Task A_refusal_at_the_provider_gives_a_page_and_signs_nobody_in()
    {
        await using var factory = new SingleSignOnFactory();
        await ((IAsyncLifetime)factory).InitializeAsync();
        var person = factory.Provider.Add("cancels", "cancels@collab.example.org", "Cancels", "gw-reviewers");
        factory.Provider.Refuse = true;
        using var browser = new SsoBrowser(factory, factory.Provider);

        var page = await browser.SignInAsync(person);

        Assert.Equal(("/signin", "sso-failed"), (browser.Location.AbsolutePath, browser.ErrorCode));
        Assert.Contains("did not complete", WebUtility.HtmlDecode(await page.Content.ReadAsStringAsync()), StringComparison.Ordinal);
        await using (var db = factory.Db())
        {
            Assert.False(await db.Users.AnyAsync(u => u.Email == person.Email));
        }

        await ((IAsyncLifetime)factory).DisposeAsync();
    }

    [Fact]
    public async Task With_local_accounts_off_only_single_sign_on_opens_and_password_sessions_end()
    {
        // One instance with passwords on makes a password session; the same database with passwords off refuses it.
        await using var before = new SingleSignOnFactory();
        await ((IAsyncLifetime)before).InitializeAsync();
        var passwordSession = await before.SignedInClientAsync(EventReviewFactory.AccountFor(Who.Coordinator));
        Assert.Equal(HttpStatusCode.OK, (await passwordSession.GetAsync("/api/cases")).StatusCode);

        await using var after = new SharedDataFactory(before.DataDirectory) { LocalAccounts = false };
        await ((IAsyncLifetime)after).InitializeAsync();
        var html = await after.Anonymous().GetStringAsync("/signin");
        Assert.DoesNotContain("name=\"password\"", html, StringComparison.Ordinal);
        Assert.DoesNotContain("Demo accounts", html, StringComparison.Ordinal);
        Assert.Contains("Local accounts (e-mail and password) are switched off on this server.", html, StringComparison.Ordinal);

        // A sign-in page loaded before the switch (its form token still valid: same keys) posts a password: refused.
        using var raw = after.CreateClient(new() { AllowAutoRedirect = false, HandleCookies = false });
        var (antiforgery, token) = await SignInFormAsync(before);
        var refused = await PostPasswordAsync(raw, antiforgery, token);
        Assert.Contains("error=local-off", refused.Headers.Location?.OriginalString, StringComparison.Ordinal);
        Assert.False(refused.Headers.TryGetValues("Set-Cookie", out var set) && set.Any(c => c.StartsWith("eventreview.auth=", StringComparison.Ordinal)));
        await using (var db = after.Db())
        {
            Assert.True(await db.AccountEvents.AnyAsync(e => e.Kind == AccountEventKinds.SignInFailed && e.Detail == "local accounts are switched off"));
        }

        // The cookie of a password session made by the other instance means nothing here (same keys, same database).
        var (antiforgery2, token2) = await SignInFormAsync(before);
        var madeBefore = await PostPasswordAsync(before.CreateClient(new() { AllowAutoRedirect = false, HandleCookies = false }), antiforgery2, token2);
        var cookie = madeBefore.Headers.GetValues("Set-Cookie").Select(c => c.Split(';')[0]).Single(c => c.StartsWith("eventreview.auth=", StringComparison.Ordinal));
        using var beforeRaw = before.CreateClient(new() { AllowAutoRedirect = false, HandleCookies = false });
        Assert.Equal(HttpStatusCode.OK, (await beforeRaw.SendAsync(WithCookie("/api/cases", cookie))).StatusCode);
        Assert.Equal(HttpStatusCode.Unauthorized, (await raw.SendAsync(WithCookie("/api/cases", cookie))).StatusCode);

        var person = after.Provider.Add("only-sso", "only-sso@collab.example.org", "Only Sso", "gw-reviewers");
        using var browser = new SsoBrowser(after, after.Provider);
        await browser.SignInAsync(person);
        Assert.Equal(HttpStatusCode.OK, (await browser.App.GetAsync("/api/cases")).StatusCode);
        await ((IAsyncLifetime)after).DisposeAsync();
        await ((IAsyncLifetime)before).DisposeAsync();
    }

    private static async Task<(string Cookie, string Token)> SignInFormAsync(EventReviewFactory factory)
    {
        using var client = factory.CreateClient(new() { AllowAutoRedirect = false, HandleCookies = false });
        var get = await client.GetAsync("/signin");
        var antiforgery = get.Headers.GetValues("Set-Cookie").Select(c => c.Split(';')[0]).Single(c => c.Contains("Antiforgery", StringComparison.OrdinalIgnoreCase));
        return (antiforgery, EventReviewFactory.AntiforgeryTokenIn(await get.Content.ReadAsStringAsync())!);
    }

    private static Task<HttpResponseMessage> PostPasswordAsync(HttpClient client, string cookie, string token)
    {
        var account = EventReviewFactory.AccountFor(Who.Coordinator);
        var post = new HttpRequestMessage(HttpMethod.Post, "/account/signin")
        {
            Content = new FormUrlEncodedContent(new Dictionary<string, string>
            {
                ["__RequestVerificationToken"] = token,
                ["email"] = account.Email,
                ["password"] = account.Password,
                ["returnUrl"] = "/cases",
            }),
        };
        post.Headers.Add("Cookie", cookie);
        return client.SendAsync(post);
    }

    private static HttpRequestMessage WithCookie(string path, string cookie)
    {
        var request = new HttpRequestMessage(HttpMethod.Get, path);
        request.Headers.Add("Cookie", cookie);
        return request;
    }

    private static int ClosedPort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port; // closed again when disposed: nothing answers there
    }

    /// <summary>The app with extra settings (for start-up checks; it is never asked anything).</summary>
    private sealed class ConfiguredFactory(Dictionary<string, string> settings) : EventReviewFactory
    {
        protected override void ConfigureWebHost(IWebHostBuilder builder)
        {
            base.ConfigureWebHost(builder);
            foreach (var (key, value) in settings)
            {
                builder.UseSetting(key, value);
            }
        }
    }

    /// <summary>Single sign-on on another instance's data folder (same SQLite database and key ring).</summary>
    private sealed class SharedDataFactory(string dataDirectory) : SingleSignOnFactory
    {
        protected override void ConfigureWebHost(IWebHostBuilder builder)
        {
            base.ConfigureWebHost(builder);
            builder.UseSetting("EventReview:DataDirectory", dataDirectory);
        }
    }
}
