using Microsoft.Playwright;

namespace EventReview.Browser.Tests;

/// <summary>
/// Single sign-on in headless Chromium against the in-process provider: the sign-in page with both ways in, the
/// provider's form, signing an item with a fresh sign-in there, the profile page, and the page shown when the provider
/// is down. Screenshots (1440x900) go to screenshots/ in the test output folder.
/// </summary>
public sealed class SingleSignOnBrowserTests(SsoRunningApp app) : IClassFixture<SsoRunningApp>
{
    private const string CaseId = "ER-C-0142";
    private const string ItemKey = "timing.uncertainty";

    private static readonly string Screenshots = Path.Combine(AppContext.BaseDirectory, "screenshots");

    [Fact]
    public async Task A_person_signs_in_at_the_provider_and_signs_an_item_by_signing_in_there_again()
    {
        Directory.CreateDirectory(Screenshots);
        using var playwright = await Playwright.CreateAsync();
        await using var browser = await Chromium.LaunchAsync(playwright);
        var size = new BrowserNewContextOptions { ViewportSize = new ViewportSize { Width = 1440, Height = 900 } };
        var context = await browser.NewContextAsync(size);
        context.SetDefaultTimeout(60_000);
        var page = await context.NewPageAsync();
        try
        {
            var itemUrl = await PrepareItemAsync(browser, size);

            // The sign-in page explains both ways in; the provider asks for the credentials.
            await page.GotoAsync($"{app.BaseUrl}/signin");
            await Assertions.Expect(page.Locator("#signin-sso")).ToContainTextAsync($"Sign in with {SsoRunningApp.ProviderName}");
            await Shot(page, "sso-1-sign-in");
            await page.Locator("#signin-sso").ClickAsync();
            await page.WaitForURLAsync(AtProviderLogin);

            await LogInAtProviderAsync(page);
            await page.WaitForURLAsync("**/cases");
            await Assertions.Expect(page.Locator(".profile-link")).ToContainTextAsync("Rita Reviewer · reviewer");

            // Signing sends her to the provider again (prompt=login), and back to the item, signed.
            await page.GotoAsync(itemUrl);
            await page.Locator("#interactive-ready").WaitForAsync(new() { State = WaitForSelectorState.Attached });
            const string statement = "Compared each site's timing uncertainty with its calibration report.";
            await page.Locator("#sign-statement").FillAsync(statement);

            // Leave the field so that its value reaches the server before the click (the field updates on change); the
            // counter under it shows the length the server holds, so wait for that rather than for a fixed time.
            await page.Locator("#sign-statement").PressAsync("Tab");
            await Assertions.Expect(page.Locator(".sign-form")).ToContainTextAsync($"{statement.Length} / 4000"); // InputLimits.MaxStatementLength
            await Assertions.Expect(page.Locator("#sign-sso-button")).ToBeVisibleAsync();
            await page.Locator(".sign-form").ScrollIntoViewIfNeededAsync();
            await Shot(page, "sso-2-sign-form");
            await page.Locator(".sign-form").ScreenshotAsync(new() { Path = Path.Combine(Screenshots, "sso-2-sign-form-detail.png") });
            var logins = app.Provider.Logins;
            await page.Locator("#sign-sso-button").ClickAsync();
            await page.WaitForURLAsync(AtProviderLogin);
            await Shot(page, "sso-3-provider-asks-again");
            await LogInAtProviderAsync(page);
            await page.WaitForURLAsync("**/items/**");
            await Assertions.Expect(page.Locator(".mud-alert-message").First).ToContainTextAsync("Signed after you signed in again");
            await Assertions.Expect(page.Locator("ul.signoffs")).ToContainTextAsync("Rita Reviewer");
            Assert.Equal(logins + 1, app.Provider.Logins);
            await Shot(page, "sso-4-signed");

            // Her profile: how she signed in, her notification choices, a test message the unreachable SMTP server delays.
            await page.GotoAsync($"{app.BaseUrl}/profile");
            await page.Locator("#interactive-ready").WaitForAsync(new() { State = WaitForSelectorState.Attached });
            await page.Locator("#send-test").ClickAsync();
            await Assertions.Expect(page.Locator(".mud-alert-message").First).ToContainTextAsync("test message is queued");
            await Task.Delay(4000);
            await page.ReloadAsync();
            await Assertions.Expect(page.Locator("#messages")).ToContainTextAsync("retrying");
            await Shot(page, "sso-5-profile", fullPage: true);

            // The coordinators' Team page says where roles of single sign-on accounts come from.
            await ShowTeamAsync(browser, size);

            // The provider goes down: the sign-in page says so, and the local form still works.
            await page.Locator("button.signout").ClickAsync();
            await page.WaitForURLAsync("**/signin**");
            await app.Provider.StopAsync();
            await page.Locator("#signin-sso").ClickAsync();
            await page.WaitForURLAsync("**/signin?error=sso-unavailable**");
            await Assertions.Expect(page.Locator(".signin-error")).ToContainTextAsync("did not answer");
            await Shot(page, "sso-6-provider-down");
        }
        catch
        {
            await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, "sso-failure.png"), FullPage = true });
            await File.WriteAllTextAsync(Path.Combine(Screenshots, "sso-failure.log"), $"at {page.Url}\n{app.Log}");
            throw;
        }
    }

    /// <summary>Demo reviewer A (a local account) adds a note to the item and marks it ready; returns the item's address.</summary>
    private async Task<string> PrepareItemAsync(IBrowser browser, BrowserNewContextOptions size)
    {
        await using var context = await browser.NewContextAsync(size);
        context.SetDefaultTimeout(60_000);
        var page = await context.NewPageAsync();
        await page.GotoAsync($"{app.BaseUrl}/signin");
        await page.Locator("#email").FillAsync("reviewer.a@demo.invalid");
        await page.Locator("#password").FillAsync("DemoReviewerA1");
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in", Exact = true }).ClickAsync();
        await page.WaitForURLAsync("**/cases");
        await page.GetByRole(AriaRole.Link, new() { Name = CaseId }).ClickAsync();
        await page.WaitForURLAsync("**/cases/*");
        var itemUrl = $"{app.BaseUrl}{new Uri(page.Url).AbsolutePath.TrimEnd('/')}/items/{ItemKey}";
        await page.GotoAsync(itemUrl);
        await page.Locator("#interactive-ready").WaitForAsync(new() { State = WaitForSelectorState.Attached });
        await page.Locator("textarea#note-text").FillAsync("Timing uncertainty of each site taken from its calibration report.");
        await page.Locator("#add-note").ClickAsync();
        await Assertions.Expect(page.Locator("ul.evidence")).ToContainTextAsync("Timing uncertainty of each site");
        await page.Locator("#mark-ready").ClickAsync();
        await Assertions.Expect(page.Locator(".item-panel .state").First).ToContainTextAsync("ready for sign-off");
        return itemUrl;
    }

    /// <summary>The demo coordinator (local account) opens the Team page, which lists the new account and says roles follow the groups.</summary>
    private async Task ShowTeamAsync(IBrowser browser, BrowserNewContextOptions size)
    {
        await using var context = await browser.NewContextAsync(size);
        context.SetDefaultTimeout(60_000);
        var page = await context.NewPageAsync();
        await page.GotoAsync($"{app.BaseUrl}/signin");
        await page.Locator("#email").FillAsync("coordinator@demo.invalid");
        await page.Locator("#password").FillAsync("DemoCoordinator1");
        await page.GetByRole(AriaRole.Button, new() { Name = "Sign in", Exact = true }).ClickAsync();
        await page.WaitForURLAsync("**/cases");
        await page.GotoAsync($"{app.BaseUrl}/team");
        await Assertions.Expect(page.Locator("main, body").First).ToContainTextAsync("get their role from their groups there");
        await Assertions.Expect(page.Locator("table.data").First).ToContainTextAsync("rita.reviewer@collab.example.org");
        await Shot(page, "sso-7-team", fullPage: true);
    }

    private bool AtProviderLogin(string url) => url.StartsWith(app.Provider.BaseUrl + "login", StringComparison.Ordinal);

    private async Task LogInAtProviderAsync(IPage page)
    {
        await page.Locator("#idp-username").FillAsync(app.Reviewer.UserName);
        await page.Locator("#idp-password").FillAsync(app.Reviewer.Password);
        await page.Locator("#idp-submit").ClickAsync();
    }

    private static Task Shot(IPage page, string name, bool fullPage = false) =>
        page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, name + ".png"), FullPage = fullPage });
}
