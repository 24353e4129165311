using Microsoft.Playwright;

namespace EventReview.Browser.Tests;

/// <summary>
/// One end-to-end path in headless Chromium: reviewer A adds a note and marks an item ready; reviewer B signs it off.
/// Screenshots go to screenshots/ in the test output folder.
/// </summary>
public sealed class ReviewerSignOffTests(RunningApp app) : IClassFixture<RunningApp>
{
    private const string CaseId = "ER-C-0142";
    private const string ItemKey = "timing.uncertainty"; // needs one sign-off (timing.arrival needs two)

    private static readonly string Screenshots = Path.Combine(AppContext.BaseDirectory, "screenshots");

    [Fact]
    public async Task A_reviewer_adds_a_note_and_another_reviewer_signs_the_item_off()
    {
        Directory.CreateDirectory(Screenshots);
        using var playwright = await Playwright.CreateAsync();
        await using var browser = await Chromium.LaunchAsync(playwright);
        var context = await browser.NewContextAsync(new BrowserNewContextOptions { ViewportSize = new ViewportSize { Width = 1400, Height = 1000 } });
        context.SetDefaultTimeout(30_000);
        var page = await context.NewPageAsync();
        try
        {
            // Reviewer A: open the case from the list, open the item, add a note, mark it ready.
            await SignInAsync(page, "reviewer.a@demo.invalid", "DemoReviewerA1");
            await page.GetByRole(AriaRole.Link, new() { Name = CaseId }).ClickAsync();
            await page.WaitForURLAsync("**/cases/*");
            var caseUrl = new Uri(page.Url).AbsolutePath.TrimEnd('/');
            await page.GotoAsync($"{app.BaseUrl}{caseUrl}/items/{ItemKey}");
            await WaitInteractiveAsync(page);
            await Assertions.Expect(page.Locator("#item-title")).ToBeVisibleAsync();

            var note = $"Timing uncertainty of each site taken from its calibration report (checked {DateTime.UtcNow:HH:mm:ss} UTC).";
            await page.Locator("textarea#note-text").FillAsync(note);
            await Assertions.Expect(page.Locator("textarea#note-text")).ToHaveValueAsync(note);
            await page.Locator("#add-note").ClickAsync();
            await LostClick.RetryAsync(page, app, "reviewer-note", note, "Timing uncertainty of each site");
            await Assertions.Expect(page.Locator("ul.evidence")).ToContainTextAsync("Timing uncertainty of each site", new() { Timeout = 60_000 });
            await Assertions.Expect(page.Locator("textarea#note-text")).ToHaveValueAsync(string.Empty);

            await page.Locator("#mark-ready").ClickAsync();
            await Assertions.Expect(page.Locator(".item-panel .state").First).ToContainTextAsync("ready for sign-off");
            await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, "1-reviewer-a-ready.png"), FullPage = true });
            await page.Locator("button.signout").ClickAsync();
            await page.WaitForURLAsync("**/signin**");

            // Reviewer B: open the same item and sign it.
            await SignInAsync(page, "reviewer.b@demo.invalid", "DemoReviewerB1");
            await page.GotoAsync($"{app.BaseUrl}{caseUrl}/items/{ItemKey}");
            await WaitInteractiveAsync(page);
            await Assertions.Expect(page.Locator("ul.evidence")).ToContainTextAsync("Timing uncertainty of each site");
            await page.Locator("#sign-statement").FillAsync("Read the three calibration reports myself.");
            await page.Locator("#sign-password").FillAsync("DemoReviewerB1");
            await page.Locator("#sign-button").ClickAsync();

            await Assertions.Expect(page.Locator(".item-panel .state").First).ToContainTextAsync("signed off");
            await Assertions.Expect(page.Locator("ul.signoffs")).ToContainTextAsync("Demo Reviewer B");
            await Assertions.Expect(page.Locator($"li[data-item='{ItemKey}'] .state")).ToContainTextAsync("signed off");
            await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, "2-reviewer-b-signed.png"), FullPage = true });
        }
        catch
        {
            await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, "failure.png"), FullPage = true });
            throw;
        }

        Assert.True(new FileInfo(Path.Combine(Screenshots, "2-reviewer-b-signed.png")).Length > 10_000);
    }

    private async Task SignInAsync(IPage page, string email, string password)
    {
        await page.GotoAsync($"{app.BaseUrl}/signin");
        await page.Locator("#email").FillAsync(email);
        await page.Locator("#password").FillAsync(password);
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
        await page.WaitForURLAsync("**/cases");
    }

    /// <summary>The page is prerendered before its circuit is live; clicks before that are lost.</summary>
    private static Task WaitInteractiveAsync(IPage page) =>
        page.Locator("#interactive-ready").WaitForAsync(new() { State = WaitForSelectorState.Attached });
}
