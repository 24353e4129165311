using System.Text.Json.Nodes;
using Microsoft.Playwright;

namespace EventReview.Browser.Tests;

/// <summary>
/// Stored-script attempts through a note, a file name, a site name and an uploaded SVG: in each case the browser runs
/// nothing (the payloads would set <c>window.__xss</c>) and the text is shown inert. Also: the app's own pages cause no
/// content security policy violation.
/// </summary>
public sealed class StoredScriptTests(RunningApp app) : IClassFixture<RunningApp>
{
    private const string CaseId = "ER-C-0142";
    private const string ItemKey = "timing.arrival";
    private const string Coordinator = "coordinator@demo.invalid";

    private static readonly string Screenshots = Path.Combine(AppContext.BaseDirectory, "screenshots");

    // Records every CSP violation the page reports, and leaves window.__xss unset unless a payload runs.
    private const string Watch = """
        window.__csp = [];
        document.addEventListener('securitypolicyviolation', e => window.__csp.push(e.violatedDirective + ' ' + e.blockedURI));
        """;

    [Fact]
    public async Task The_apps_own_pages_run_with_no_content_security_policy_violation()
    {
        await WithPageAsync("csp", async (page, console) =>
        {
            foreach (var path in new[] { "/cases", "/network", "/team", "/tokens" })
            {
                await page.GotoAsync(app.BaseUrl + path);
                await WaitInteractiveAsync(page);
                await AssertNoViolationAsync(page, console, path);
            }

            await OpenItemAsync(page);
            await AssertNoViolationAsync(page, console, "item page");
        });
    }

    [Fact]
    public async Task A_note_with_script_an_onerror_image_and_a_javascript_link_renders_inert()
    {
        await WithPageAsync("note", async (page, _) =>
        {
            await OpenItemAsync(page);
            const string note = "Payload check <script>window.__xss = 1</script>\n\n<img src=x onerror=\"window.__xss = 2\">\n\n[harmless looking link](javascript:window.__xss=3)";
            // The note field sends its text on change: fill, check the field kept it, leave it (change), then add.
            var field = page.Locator("textarea#note-text");
            await field.FillAsync(note);
            await Assertions.Expect(field).ToHaveValueAsync(note);
            await field.PressAsync("Tab");
            await page.Locator("#add-note").ClickAsync();
            await LostClick.RetryAsync(page, app, "xss-note", note, "Payload check");
            var evidence = page.Locator("ul.evidence");
            await Assertions.Expect(evidence).ToContainTextAsync("Payload check", new() { Timeout = 60_000 }); // one click; a busy test machine can take seconds to store it
            await Assertions.Expect(evidence).ToContainTextAsync("harmless looking link");

            Assert.Equal(0, await evidence.Locator("script").CountAsync());
            Assert.Equal(0, await evidence.Locator("[onerror]").CountAsync());
            var hrefs = await evidence.Locator("a").EvaluateAllAsync<string[]>("links => links.map(a => a.getAttribute('href') || '')");
            Assert.DoesNotContain(hrefs, h => h.TrimStart().StartsWith("javascript:", StringComparison.OrdinalIgnoreCase));
            await evidence.GetByText("harmless looking link").ClickAsync();
            await page.WaitForTimeoutAsync(300);
            await AssertNothingRanAsync(page);
        });
    }

    [Fact]
    public async Task An_attachment_whose_name_is_html_is_listed_as_plain_text()
    {
        await WithPageAsync("file-name", async (page, _) =>
        {
            await OpenItemAsync(page);
            const string name = "<img src=x onerror=window.__xss=4>.png";
            await AttachAsync(page, new FilePayload { Name = name, MimeType = "image/png", Buffer = "not really a png"u8.ToArray() });
            var evidence = page.Locator("ul.evidence");
            await Assertions.Expect(evidence).ToContainTextAsync(name);

            Assert.Equal(0, await evidence.Locator("img[onerror]").CountAsync());
            await AssertNothingRanAsync(page);
            await page.ReloadAsync();
            await WaitInteractiveAsync(page);
            await Assertions.Expect(page.Locator("ul.evidence")).ToContainTextAsync(name);
            await AssertNothingRanAsync(page);
        });
    }

    [Fact]
    public async Task A_site_name_with_html_is_shown_as_text()
    {
        await WithPageAsync("site-name", async (page, _) =>
        {
            await page.GotoAsync(app.BaseUrl + "/network");
            await WaitInteractiveAsync(page);
            var exported = await page.APIRequest.GetAsync(app.BaseUrl + "/network.json");
            Assert.Equal(200, exported.Status);
            var network = JsonNode.Parse(await exported.TextAsync())!;
            const string name = "Ridge <img src=x onerror=window.__xss=5><script>window.__xss=6</script>";
            network["sites"]![0]!["name"] = name;

            await page.Locator("input[type=file]").SetInputFilesAsync(new FilePayload { Name = "network.json", MimeType = "application/json", Buffer = System.Text.Encoding.UTF8.GetBytes(network.ToJsonString()) });
            await Assertions.Expect(page.Locator("table.data").First).ToContainTextAsync(name);

            Assert.Equal(0, await page.Locator("table.data img, table.data script").CountAsync());
            await AssertNothingRanAsync(page);
            await page.ReloadAsync();
            await WaitInteractiveAsync(page);
            await Assertions.Expect(page.Locator("table.data").First).ToContainTextAsync(name);
            await AssertNothingRanAsync(page);
        });
    }

    [Fact]
    public async Task An_uploaded_svg_with_script_is_only_ever_downloaded()
    {
        await WithPageAsync("svg", async (page, _) =>
        {
            await OpenItemAsync(page);
            var svg = "<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"10\" height=\"10\"><script>window.__xss = 7; document.title = 'owned'</script></svg>"u8.ToArray();
            await AttachAsync(page, new FilePayload { Name = "scripted-plot.svg", MimeType = "image/svg+xml", Buffer = svg });
            var link = page.Locator("ul.evidence a", new() { HasText = "scripted-plot.svg" }).First;
            await Assertions.Expect(link).ToBeVisibleAsync();
            var title = await page.TitleAsync();

            var download = await page.RunAndWaitForDownloadAsync(() => link.ClickAsync());

            Assert.Equal("scripted-plot.svg", download.SuggestedFilename);
            await AssertNothingRanAsync(page);
            Assert.Equal(title, await page.TitleAsync());

            // Opening the address directly also only downloads: the page never becomes the SVG document.
            var direct = await page.Context.NewPageAsync();
            var directDownload = direct.WaitForDownloadAsync();
            try
            {
                await direct.GotoAsync(app.BaseUrl + await link.GetAttributeAsync("href"));
            }
            catch (PlaywrightException ex) when (ex.Message.Contains("Download is starting", StringComparison.Ordinal) || ex.Message.Contains("ERR_ABORTED", StringComparison.Ordinal))
            {
            }

            Assert.Equal("scripted-plot.svg", (await directDownload).SuggestedFilename);
            Assert.Null(await direct.EvaluateAsync<int?>("() => window.__xss ?? null"));
            Assert.NotEqual("owned", await direct.TitleAsync());
        });
    }

    private async Task WithPageAsync(string name, Func<IPage, List<string>, Task> body)
    {
        Directory.CreateDirectory(Screenshots);
        using var playwright = await Playwright.CreateAsync();
        await using var browser = await Chromium.LaunchAsync(playwright);
        var context = await browser.NewContextAsync(new BrowserNewContextOptions { ViewportSize = new ViewportSize { Width = 1400, Height = 1000 }, AcceptDownloads = true });
        context.SetDefaultTimeout(30_000);
        await context.AddInitScriptAsync(Watch);
        var page = await context.NewPageAsync();
        var console = new List<string>();
        page.Console += (_, m) =>
        {
            if (m.Type == "error")
            {
                lock (console)
                {
                    console.Add(m.Text);
                }
            }
        };
        try
        {
            await SignInAsync(page);
            await body(page, console);
            await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, $"xss-{name}.png"), FullPage = true });
        }
        catch
        {
            await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, $"xss-{name}-failure.png"), FullPage = true });
            throw;
        }
    }

    private async Task SignInAsync(IPage page)
    {
        await page.GotoAsync($"{app.BaseUrl}/signin");
        await page.Locator("#email").FillAsync(Coordinator);
        await page.Locator("#password").FillAsync("DemoCoordinator1");
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await page.WaitForURLAsync("**/cases");
    }

    private async Task OpenItemAsync(IPage page)
    {
        await page.GotoAsync($"{app.BaseUrl}/cases");
        // The case's link gives its address; going there directly does not race the list page becoming interactive.
        var caseUrl = (await page.GetByRole(AriaRole.Link, new() { Name = CaseId }).GetAttributeAsync("href"))!.TrimEnd('/');
        await page.GotoAsync($"{app.BaseUrl}{(caseUrl.StartsWith('/') ? caseUrl : "/" + caseUrl)}/items/{ItemKey}");
        await WaitInteractiveAsync(page);
        await Assertions.Expect(page.Locator("#item-title")).ToBeVisibleAsync();
    }

    /// <summary>Chooses the file, then confirms the role shown (guessed from its first bytes) to store it.</summary>
    private static async Task AttachAsync(IPage page, FilePayload file)
    {
        await (await AttachInputAsync(page)).SetInputFilesAsync(file);
        await page.Locator("#attach-button").ClickAsync();
    }

    private static async Task<ILocator> AttachInputAsync(IPage page)
    {
        await page.Locator(".mud-tab", new() { HasText = "Attach a file" }).ClickAsync();
        var input = page.Locator(".item-panel input[type=file]");
        await input.WaitForAsync(new() { State = WaitForSelectorState.Attached });
        return input;
    }

    private static async Task AssertNothingRanAsync(IPage page)
    {
        Assert.Null(await page.EvaluateAsync<int?>("() => window.__xss ?? null"));
        Assert.NotEqual("owned", await page.TitleAsync());
    }

    private static async Task AssertNoViolationAsync(IPage page, List<string> console, string where)
    {
        var violations = await page.EvaluateAsync<string[]>("() => window.__csp");
        Assert.True(violations.Length == 0, $"{where}: {string.Join("; ", violations)}");
        lock (console)
        {
            Assert.DoesNotContain(console, m => m.Contains("Content Security Policy", StringComparison.OrdinalIgnoreCase));
        }
    }

    private static Task WaitInteractiveAsync(IPage page) =>
        page.Locator("#interactive-ready").WaitForAsync(new() { State = WaitForSelectorState.Attached });
}
