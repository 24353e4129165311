using System.Net;
using System.Text.Json;
using EventReview.Data;
using EventReview.Web.Tests.Reliability;
using Microsoft.EntityFrameworkCore;
using Npgsql;

namespace EventReview.Web.Tests.Operations;

/// <summary>
/// The team-server start of docs/operations.md, for real: the built app in Production (no demo), started from a
/// folder that is not its own, its settings only in environment variables as a systemd environment file gives them;
/// the first coordinator and a pipeline token made with the command-line tool reading the same variables; a browser
/// behind a proxy on the same machine (X-Forwarded-For/-Proto from loopback, listed as a trusted proxy); then the JSON
/// log is read whole.
/// </summary>
public sealed class TeamServerStartTests
{
    private const string Password = "Lead-Coordinator-Passphrase-42";
    private const string WrongPassword = "Not-The-Passphrase-77";

    [Theory]
    [InlineData("Sqlite")]
    [InlineData("Postgres")]
    public async Task A_production_server_starts_from_the_operations_guide_honours_the_proxy_and_logs_json_without_secrets(string provider)
    {
        var data = Path.Combine(Path.GetTempPath(), $"er-ops-{Guid.NewGuid():N}");
        var elsewhere = Directory.CreateTempSubdirectory("er-ops-cwd-").FullName;
        var env = new Dictionary<string, string>
        {
            ["ASPNETCORE_ENVIRONMENT"] = "Production",
            ["EventReview__DataDirectory"] = data,
            ["EventReview__SeedDemo"] = "false",

            // The proxy of the guide runs on this machine; it must be listed (loopback is not trusted by default).
            ["EventReview__Operations__TrustedProxies__0"] = "127.0.0.1",
        };
        if (provider == "Postgres")
        {
            env["Database__Provider"] = "Postgres";
            env["ConnectionStrings__Default"] = await EventReview.Web.Tests.Fixtures.PostgresDatabases.FreshAsync("er_ops");
        }

        try
        {
            // The first coordinator and a pipeline token, as the guide says (no --data/--connection: the environment decides).
            var add = await ChildProcesses.RunCliAsync(TimeSpan.FromMinutes(2), env, "users", "add", "--email", "lead@example.org", "--role", "coordinator", "--name", "A. Lead", "--password", Password);
            Assert.True(add.Exit == 0, add.Err + add.Out);
            var made = await ChildProcesses.RunCliAsync(TimeSpan.FromMinutes(2), env, "tokens", "create", "--name", "search A", "--json");
            Assert.True(made.Exit == 0, made.Err + made.Out);
            var secret = JsonDocument.Parse(made.Out).RootElement.GetProperty("token").GetString()!;

            // The network from a file, also from the command line alone.
            Directory.CreateDirectory(data);
            var networkFile = Path.Combine(data, "network.json");
            await File.WriteAllTextAsync(networkFile, """
                {"name": "start test", "sites": [{"code": "QA", "name": "Quarry A", "latitudeDegrees": 12.5, "longitudeDegrees": -40.25, "heightMeters": 120,
                  "xArmAzimuthDegrees": 10, "yArmAzimuthDegrees": 100, "timingUncertaintySeconds": 0.0005}]}
                """);
            var imported = await ChildProcesses.RunCliAsync(TimeSpan.FromMinutes(2), env, "network", "import", "--file", networkFile);
            Assert.True(imported.Exit == 0, imported.Err + imported.Out);

            await using var server = await ServerProcess.StartAsync(data, env, elsewhere, readyPath: "/healthz/ready");
            using var http = new HttpClient(new HttpClientHandler { UseCookies = false, AllowAutoRedirect = false }) { BaseAddress = new Uri(server.BaseUrl) };

            var health = await http.GetAsync("/healthz/ready");
            var healthText = await health.Content.ReadAsStringAsync();
            Assert.True(health.StatusCode == HttpStatusCode.OK, healthText);
            Assert.Contains($"{provider} database answers", healthText, StringComparison.Ordinal);

            // Straight to the app over plain HTTP, a page explains that HTTPS is needed.
            var plain = await http.GetAsync("/signin");
            Assert.Equal(HttpStatusCode.BadRequest, plain.StatusCode);
            Assert.Contains("must be reached over HTTPS", await plain.Content.ReadAsStringAsync(), StringComparison.Ordinal);

            // Behind the proxy: the sign-in cookie is Secure because the proxy said https, and the audit has the client's address.
            var (cookie, token) = await SignInFormAsync(http);
            var wrong = await PostSignInAsync(http, cookie, token, WrongPassword);
            Assert.Contains("error=", wrong.Headers.Location?.OriginalString, StringComparison.Ordinal);
            var (cookie2, token2) = await SignInFormAsync(http);
            var signedIn = await PostSignInAsync(http, cookie2, token2, Password);
            var authCookie = signedIn.Headers.GetValues("Set-Cookie").Single(c => c.StartsWith("eventreview.auth=", StringComparison.Ordinal));
            Assert.Contains("secure", authCookie, StringComparison.OrdinalIgnoreCase);
            Assert.Contains("httponly", authCookie, StringComparison.OrdinalIgnoreCase);

            using var open = new HttpRequestMessage(HttpMethod.Post, "/api/cases")
            {
                Content = new StringContent("""{"candidateId":"OPS-1","gpsTime":1400000000.5,"checklist":"rapid-triage"}""", System.Text.Encoding.UTF8, "application/json"),
            };
            open.Headers.Authorization = new System.Net.Http.Headers.AuthenticationHeaderValue("Bearer", secret);
            var opened = await http.SendAsync(open);
            Assert.Equal(HttpStatusCode.Created, opened.StatusCode);
            var requestId = opened.Headers.GetValues("X-Request-Id").Single();

            await using (var db = Database(provider, env, data))
            {
                var events = await db.AccountEvents.AsNoTracking().OrderBy(e => e.Sequence).ToListAsync();
                Assert.Contains(events, e => e.Address == "203.0.113.7" && e.Account == "lead@example.org" && e.Kind.Contains("fail", StringComparison.OrdinalIgnoreCase));
                Assert.Contains(events, e => e.Address == "203.0.113.7" && e.UserId is not null);
            }

            await Task.Delay(500); // let the console logger drain
            var log = server.Log.ToString();
            var lines = log.Split('\n', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
            Assert.NotEmpty(lines);
            foreach (var line in lines)
            {
                using var parsed = JsonDocument.Parse(line); // every line is one JSON object
                Assert.Equal(JsonValueKind.Object, parsed.RootElement.ValueKind);
            }

            // The line the case opening wrote carries the request id the response gave; so do the sign-in audit lines.
            Assert.Contains(lines, l => l.Contains("OPS-1", StringComparison.Ordinal) && l.Contains($"\"RequestId\":\"{requestId}\"", StringComparison.Ordinal));
            Assert.Contains(lines, l => l.Contains("signin.failed", StringComparison.Ordinal) && l.Contains("\"RequestId\":", StringComparison.Ordinal));
            foreach (var forbidden in new[] { Password, WrongPassword, secret, CookieValue(authCookie), CookieValue(cookie) })
            {
                Assert.DoesNotContain(forbidden, log, StringComparison.Ordinal);
            }
        }
        finally
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            NpgsqlConnection.ClearAllPools();
            TryDelete(data);
            TryDelete(elsewhere);
        }
    }

    private static async Task<(string Cookie, string Token)> SignInFormAsync(HttpClient http)
    {
        using var get = ViaProxy(new HttpRequestMessage(HttpMethod.Get, "/signin"));
        var page = await http.SendAsync(get);
        var html = await page.Content.ReadAsStringAsync();
        var cookie = page.Headers.GetValues("Set-Cookie").Select(c => c.Split(';')[0]).Single(c => c.Contains("Antiforgery", StringComparison.OrdinalIgnoreCase));
        var token = EventReview.Web.Tests.Fixtures.EventReviewFactory.AntiforgeryTokenIn(html);
        Assert.False(string.IsNullOrEmpty(token), "the sign-in page has no antiforgery token");
        return (cookie, token);
    }

    private static async Task<HttpResponseMessage> PostSignInAsync(HttpClient http, string cookie, string token, string password)
    {
        var post = ViaProxy(new HttpRequestMessage(HttpMethod.Post, "/account/signin")
        {
            Content = new FormUrlEncodedContent(new Dictionary<string, string>
            {
                ["email"] = "lead@example.org",
                ["password"] = password,
                ["returnUrl"] = "/cases",
                ["__RequestVerificationToken"] = token,
            }),
        });
        post.Headers.Add("Cookie", cookie);
        var response = await http.SendAsync(post);
        Assert.Equal(HttpStatusCode.Redirect, response.StatusCode);
        return response;
    }

    private static HttpRequestMessage ViaProxy(HttpRequestMessage request)
    {
        // What the nginx example sends; the app trusts it because the connection comes from 127.0.0.1, listed in TrustedProxies.
        request.Headers.Add("X-Forwarded-For", "203.0.113.7");
        request.Headers.Add("X-Forwarded-Proto", "https");
        return request;
    }

    private static string CookieValue(string setCookie)
    {
        var pair = setCookie.Split(';')[0];
        return pair[(pair.IndexOf('=') + 1)..];
    }

    private static AppDbContext Database(string provider, Dictionary<string, string> env, string data)
    {
        var settings = DatabaseSettings.From(provider, provider == "Postgres" ? env["ConnectionStrings__Default"] : null, data);
        return new AppDbContextFactory(settings).CreateDbContext();
    }

    private static void TryDelete(string dir)
    {
        try
        {
            Directory.Delete(dir, recursive: true);
        }
        catch (IOException)
        {
        }
        catch (UnauthorizedAccessException)
        {
        }
    }
}
