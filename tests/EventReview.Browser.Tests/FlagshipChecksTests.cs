using System.Text.RegularExpressions;
using Microsoft.Playwright;

namespace EventReview.Browser.Tests;

/// <summary>
/// On the flagship demo case every item that runs a built-in check is opened and its check started with the form exactly as
/// it comes up (the preselected files and the default numbers): none may end in an error. The configuration items have no
/// run button; they must lead to the capture, freeze and compare flow instead. The sealed record's two items need the holders'
/// commitment, salt and record (no defaults): they must show their forms and the opening rule.
/// </summary>
public sealed partial class FlagshipChecksTests(RunningApp app) : IClassFixture<RunningApp>
{
    private const string CaseId = "ER-C-0142";

    private static readonly string Screenshots = Path.Combine(AppContext.BaseDirectory, "screenshots");

    [Fact]
    public async Task Every_built_in_check_runs_from_its_item_with_the_forms_defaults_without_an_error()
    {
        Directory.CreateDirectory(Screenshots);
        using var playwright = await Playwright.CreateAsync();
        await using var browser = await Chromium.LaunchAsync(playwright);
        var context = await browser.NewContextAsync(new BrowserNewContextOptions { ViewportSize = new ViewportSize { Width = 1440, Height = 900 } });
        context.SetDefaultTimeout(30_000);
        var page = await context.NewPageAsync();
        var outcomes = new List<string>();
        try
        {
            await page.GotoAsync($"{app.BaseUrl}/signin");
            await page.Locator("#email").FillAsync("coordinator@demo.invalid");
            await page.Locator("#password").FillAsync("DemoCoordinator1");
            await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
            await page.WaitForURLAsync("**/cases");
            await page.GetByRole(AriaRole.Link, new() { Name = CaseId }).ClickAsync();
            await page.WaitForURLAsync("**/cases/*");
            var caseUrl = new Uri(page.Url).AbsolutePath;
            await page.GotoAsync($"{app.BaseUrl}{caseUrl}/checklist");
            await WaitInteractiveAsync(page);

            // Every item with a check kind, read from the checklist itself.
            var checked_ = new List<(string Key, string Kind)>();
            foreach (var li in await page.Locator("li[data-item]").AllAsync())
            {
                var kind = li.Locator(".check-kind");
                if (await kind.CountAsync() > 0)
                {
                    checked_.Add(((await li.GetAttributeAsync("data-item"))!, (await kind.First.InnerTextAsync()).Trim()));
                }
            }

            Assert.Contains(checked_, c => c.Kind == "background");
            Assert.Contains(checked_, c => c.Kind == "overlap");
            foreach (var (key, kind) in checked_)
            {
                await page.GotoAsync($"{app.BaseUrl}{caseUrl}/items/{key}");
                await WaitInteractiveAsync(page);
                if (kind == "configuration")
                {
                    Assert.True(await page.Locator($"a[href$='/configuration']").CountAsync() > 0, $"{key}: no way to the configuration flow");
                    continue;
                }

                // The sealed record's items take the holders' commitment, salt and record: nothing has a default there.
                if (key == "injection.blind-seal")
                {
                    Assert.True(await page.Locator("#register-seal").CountAsync() > 0, $"{key}: no way to register a seal");
                    continue;
                }

                if (key == "injection.blind-open")
                {
                    Assert.Contains("sections", await page.Locator("#opening-rule").InnerTextAsync(), StringComparison.Ordinal);
                    continue;
                }

                var run = page.Locator("button[id^='run-']").First;
                Assert.True(await run.CountAsync() > 0, $"{key} ({kind}): no run button");
                // The runner loads the case's files after the circuit is up: let it settle before clicking.
                await page.WaitForLoadStateAsync(LoadState.NetworkIdle);
                await page.WaitForTimeoutAsync(1500);
                var before = await page.Locator(".mud-alert").AllInnerTextsAsync();
                await run.ClickAsync();
                var clickedAgain = false;

                // Wait for the answer: new messages under the form (a job's result or the runner's own message), all read at once.
                var answers = new List<(string Severity, string Text)>();
                var deadline = DateTime.UtcNow.AddMinutes(4);
                while (DateTime.UtcNow < deadline && answers.Count == 0)
                {
                    await page.WaitForTimeoutAsync(500);
                    if (!clickedAgain && DateTime.UtcNow > deadline.AddMinutes(-3.6) && await run.IsEnabledAsync())
                    {
                        // A click that landed while the form was still re-rendering is lost; a second run with the same
                        // inputs stores nothing new, so clicking once more is harmless.
                        clickedAgain = true;
                        await run.ClickAsync();
                    }

                    foreach (var alert in await page.Locator(".mud-alert").AllAsync())
                    {
                        var t = (await alert.InnerTextAsync()).Trim();
                        if (t.Length > 0 && !before.Contains(t))
                        {
                            answers.Add((Severity().Match(await alert.GetAttributeAsync("class") ?? string.Empty).Groups["s"].Value, t));
                        }
                    }
                }

                var text = string.Join(" | ", answers.Select(a => $"{a.Severity}: {a.Text}"));
                outcomes.Add($"{key} ({kind}): {text}");
                await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, $"check-{key}.png") });
                Assert.False(answers.Count == 0, $"{key} ({kind}): no answer within 4 minutes");
                Assert.DoesNotContain(answers, a => a.Severity == "error");
            }
        }
        catch
        {
            await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, "flagship-checks-failure.png"), FullPage = true });
            throw;
        }
        finally
        {
            await File.WriteAllLinesAsync(Path.Combine(Screenshots, "flagship-checks.txt"), outcomes);
        }
    }

    /// <summary>The page is prerendered before its circuit is live; clicks before that are lost.</summary>
    private static Task WaitInteractiveAsync(IPage page) =>
        page.Locator("#interactive-ready").WaitForAsync(new() { State = WaitForSelectorState.Attached });

    [GeneratedRegex("mud-alert-(text|filled|outlined)-(?<s>\\w+)")]
    private static partial Regex Severity();
}
