using System.Net;
using EventReview.Web.Tests.Fixtures;
using Microsoft.AspNetCore.Hosting;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Tests.Operations;

/// <summary>
/// Two app instances behind one proxy on one database (docs/operations.md "Two instances"): the data-protection key
/// ring is in the database, so a sign-in cookie and a form's antiforgery token made by one instance are accepted by
/// the other. An instance on another database cannot read them (the control that shows the check can fail).
/// </summary>
public sealed class TwoInstancesTests
{
    [Theory]
    [InlineData("Sqlite")]
    [InlineData("Postgres")]
    public async Task A_cookie_and_a_form_token_made_by_one_instance_are_accepted_by_the_other(string provider)
    {
        var shared = Path.Combine(Path.GetTempPath(), $"er-two-{Guid.NewGuid():N}");
        var connection = provider == "Postgres" ? await PostgresDatabases.FreshAsync("er_two") : null;
        await using var first = new InstanceFactory(shared, connection);
        // On PostgreSQL the two instances have a data folder each, as two machines would: only the database and the
        // record key folder and witness (which every instance must share, docs/operations.md section 11) are.
        await using var second = new InstanceFactory(connection is null ? shared : shared + "-b", connection,
            connection is null ? null : Path.Combine(shared, "keys"), connection is null ? null : Path.Combine(shared, "witness"));
        await using var elsewhere = new InstanceFactory(Path.Combine(Path.GetTempPath(), $"er-two-{Guid.NewGuid():N}"), provider == "Postgres" ? await PostgresDatabases.FreshAsync("er_two") : null);
        try
        {
            var account = EventReviewFactory.AccountFor(Who.Coordinator);
            using var a = first.CreateClient(new() { AllowAutoRedirect = false, HandleCookies = false });
            var (antiforgeryCookie, token) = await FormAsync(a);
            var signIn = await PostAsync(a, "/account/signin", antiforgeryCookie, token, new() { ["email"] = account.Email, ["password"] = account.Password, ["returnUrl"] = "/cases" });
            Assert.Equal(HttpStatusCode.Redirect, signIn.StatusCode);
            var auth = signIn.Headers.GetValues("Set-Cookie").Select(c => c.Split(';')[0]).Single(c => c.StartsWith("eventreview.auth=", StringComparison.Ordinal));

            // The other instance (started after the first) reads the cookie: the case list, not a redirect to sign in.
            using var b = second.CreateClient(new() { AllowAutoRedirect = false, HandleCookies = false });
            var page = await GetAsync(b, "/cases", auth);
            Assert.Equal(HttpStatusCode.OK, page.StatusCode);
            var api = await GetAsync(b, "/api/cases", auth);
            Assert.Equal(HttpStatusCode.OK, api.StatusCode);

            // A form token the first instance gave is accepted by the second (sign-out posts it).
            var (formCookie, formToken) = await FormAsync(a, "/cases", auth);
            var signOut = await PostAsync(b, "/account/signout", $"{formCookie}; {auth}", formToken, []);
            Assert.Equal(HttpStatusCode.Redirect, signOut.StatusCode);
            Assert.Equal("/signin", signOut.Headers.Location?.OriginalString);

            // An instance on another database has other keys: the same cookie means nothing there.
            using var c = elsewhere.CreateClient(new() { AllowAutoRedirect = false, HandleCookies = false });
            var refused = await GetAsync(c, "/api/cases", auth);
            Assert.Equal(HttpStatusCode.Unauthorized, refused.StatusCode);

            // The cookie keys are rows of the shared database, not key files in a data folder (the keys/ folder holds only
            // the record key).
            await using var db = first.Db();
            Assert.True(await db.DataProtectionKeys.AnyAsync());
            Assert.Empty(Directory.EnumerateFiles(shared, "key-*.xml", SearchOption.AllDirectories));
        }
        finally
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            Npgsql.NpgsqlConnection.ClearAllPools();
            try
            {
                Directory.Delete(shared, recursive: true);
                Directory.Delete(shared + "-b", recursive: true);
            }
            catch (IOException)
            {
            }
        }
    }

    private static async Task<(string Cookie, string Token)> FormAsync(HttpClient client, string path = "/signin", string? cookie = null)
    {
        using var get = new HttpRequestMessage(HttpMethod.Get, path);
        if (cookie is not null)
        {
            get.Headers.Add("Cookie", cookie);
        }

        var page = await client.SendAsync(get);
        var html = await page.Content.ReadAsStringAsync();
        var antiforgery = page.Headers.GetValues("Set-Cookie").Select(c => c.Split(';')[0]).Single(c => c.Contains("Antiforgery", StringComparison.OrdinalIgnoreCase));
        var token = EventReviewFactory.AntiforgeryTokenIn(html) ?? throw new InvalidOperationException($"{path} has no antiforgery token");
        return (antiforgery, token);
    }

    private static Task<HttpResponseMessage> PostAsync(HttpClient client, string path, string cookie, string token, Dictionary<string, string> fields)
    {
        fields["__RequestVerificationToken"] = token;
        var post = new HttpRequestMessage(HttpMethod.Post, path) { Content = new FormUrlEncodedContent(fields) };
        post.Headers.Add("Cookie", cookie);
        return client.SendAsync(post);
    }

    private static Task<HttpResponseMessage> GetAsync(HttpClient client, string path, string cookie)
    {
        var get = new HttpRequestMessage(HttpMethod.Get, path);
        get.Headers.Add("Cookie", cookie);
        return client.SendAsync(get);
    }

    /// <summary>The app on a given data folder and, for PostgreSQL, a given database (the demo is seeded once, by the first).</summary>
    private sealed class InstanceFactory(string dataDirectory, string? postgres, string? keyDirectory = null, string? witnessDirectory = null) : EventReviewFactory
    {
        protected override void ConfigureWebHost(IWebHostBuilder builder)
        {
            base.ConfigureWebHost(builder);
            builder.UseSetting("EventReview:DataDirectory", dataDirectory);
            if (keyDirectory is not null)
            {
                builder.UseSetting("EventReview:Records:KeyDirectory", keyDirectory);
                builder.UseSetting("EventReview:Records:WitnessDirectory", witnessDirectory);
            }

            if (postgres is not null)
            {
                builder.UseSetting("Database:Provider", "Postgres");
                builder.UseSetting("ConnectionStrings:Default", postgres);
            }
        }
    }
}
