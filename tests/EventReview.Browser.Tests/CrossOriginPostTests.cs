using System.Net;
using System.Net.Sockets;
using System.Text;
using System.Text.Json;
using Microsoft.Playwright;

namespace EventReview.Browser.Tests;

/// <summary>
/// A page served by another port of the same host is "same site" for the browser, so it sends the app's SameSite=Lax
/// sign-in cookie with a form post to the app. The app must refuse that post (403, nothing stored), while the same post
/// from the app's own origin goes through.
/// </summary>
public sealed class CrossOriginPostTests(RunningApp app) : IClassFixture<RunningApp>
{
    private const string CaseId = "ER-C-0157";
    private const string ItemKey = "triage.state";

    private static readonly string Screenshots = Path.Combine(AppContext.BaseDirectory, "screenshots");

    [Fact]
    public async Task A_same_site_page_on_another_port_cannot_add_evidence_with_the_signed_in_users_cookie()
    {
        Directory.CreateDirectory(Screenshots);
        using var playwright = await Playwright.CreateAsync();
        await using var browser = await Chromium.LaunchAsync(playwright);
        var context = await browser.NewContextAsync(new BrowserNewContextOptions { ViewportSize = new ViewportSize { Width = 1440, Height = 900 } });
        context.SetDefaultTimeout(30_000);
        var page = await context.NewPageAsync();

        await page.GotoAsync($"{app.BaseUrl}/signin");
        await page.Locator("#email").FillAsync("reviewer.a@demo.invalid");
        await page.Locator("#password").FillAsync("DemoReviewerA1");
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await page.WaitForURLAsync("**/cases");
        var (caseId, before) = await EvidenceCountAsync(context);

        var target = $"{app.BaseUrl}/api/cases/{caseId}/items/{ItemKey}/attachments";
        var probe = $"{app.BaseUrl}/api/cases?limit=1";
        using var other = new OtherPortSite(AttackPage(probe, target));
        var read = page.WaitForResponseAsync(r => r.Url == probe);
        var refused = page.WaitForResponseAsync(r => r.Url == target && r.Request.Method == "POST");
        await page.GotoAsync(other.Url);

        // The browser did send the sign-in cookie to the app from the other port (without it the API answers 401) ...
        Assert.Equal(200, (await read).Status);

        // ... and the app refused the write because it came from another origin.
        Assert.Equal(403, (await refused).Status);
        await Assertions.Expect(page.Locator("#done")).ToHaveTextAsync("post sent");
        await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, "cross-origin-page.png") });
        Assert.Equal(before, (await EvidenceCountAsync(context)).Count);

        // The same post from a page of the app itself is accepted: the refusal is about where it came from.
        await page.GotoAsync($"{app.BaseUrl}/cases");
        var status = await page.EvaluateAsync<int>(PostScript, target);
        Assert.Equal(201, status);
        Assert.Equal(before + 1, (await EvidenceCountAsync(context)).Count);
    }

    private const string PostScript = """
        async (target) => {
            const form = new FormData();
            form.append("file", new Blob(["posted from the app's own page"], { type: "text/plain" }), "own-page.txt");
            const r = await fetch(target, { method: "POST", body: form, credentials: "include" });
            return r.status;
        }
        """;

    private static string AttackPage(string probe, string target) => $$"""
        <!DOCTYPE html><html lang="en"><head><meta charset="utf-8"><title>Another site on the same host</title></head>
        <body style="font-family: sans-serif; margin: 3rem">
        <h1>A page on another port of the same host</h1>
        <p>On load it reads <code>{{WebUtility.HtmlEncode(probe)}}</code> and posts a file to <code>{{WebUtility.HtmlEncode(target)}}</code>, both with the browser's cookies.</p>
        <p id="done">posting...</p>
        <script>
          const form = new FormData();
          form.append("file", new Blob(["planted by another origin"], { type: "text/plain" }), "planted.txt");
          fetch({{JsonSerializer.Serialize(probe)}}, { mode: "no-cors", credentials: "include" })
            .then(() => fetch({{JsonSerializer.Serialize(target)}}, { method: "POST", mode: "no-cors", credentials: "include", body: form }))
            .finally(() => { document.getElementById("done").textContent = "post sent"; });
        </script>
        </body></html>
        """;

    /// <summary>The item's evidence count as the signed-in browser reads it through the API (same cookies).</summary>
    private async Task<(int CaseId, int Count)> EvidenceCountAsync(IBrowserContext context)
    {
        var list = await (await context.APIRequest.GetAsync($"{app.BaseUrl}/api/cases?q={CaseId}")).JsonAsync();
        var id = list!.Value.GetProperty("items")[0].GetProperty("id").GetInt32();
        var detail = await (await context.APIRequest.GetAsync($"{app.BaseUrl}/api/cases/{id}")).JsonAsync();
        var item = detail!.Value.GetProperty("items").EnumerateArray().Single(i => i.GetProperty("key").GetString() == ItemKey);
        return (id, item.GetProperty("evidenceCount").GetInt32());
    }

    /// <summary>A one-page web server on another free port of 127.0.0.1 (the same host as the app, another origin).</summary>
    private sealed class OtherPortSite : IDisposable
    {
        private readonly HttpListener _listener = new();

        public OtherPortSite(string html)
        {
            var listener = new TcpListener(IPAddress.Loopback, 0);
            listener.Start();
            var port = ((IPEndPoint)listener.LocalEndpoint).Port;
            listener.Stop();
            Url = $"http://127.0.0.1:{port}/";
            _listener.Prefixes.Add(Url);
            _listener.Start();
            _ = Task.Run(async () =>
            {
                while (_listener.IsListening)
                {
                    try
                    {
                        var ctx = await _listener.GetContextAsync();
                        var bytes = Encoding.UTF8.GetBytes(html);
                        ctx.Response.ContentType = "text/html; charset=utf-8";
                        await ctx.Response.OutputStream.WriteAsync(bytes);
                        ctx.Response.Close();
                    }
                    catch (Exception ex) when (ex is HttpListenerException or ObjectDisposedException or InvalidOperationException)
                    {
                        return;
                    }
                }
            });
        }

        public string Url { get; }

        public void Dispose() => _listener.Close();
    }
}
