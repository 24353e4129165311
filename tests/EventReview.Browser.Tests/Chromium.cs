using Microsoft.Playwright;

namespace EventReview.Browser.Tests;

/// <summary>Debian's Chromium, headless, with the flags that work on this machine (never Playwright's own download).</summary>
public static class Chromium
{
    /// <summary>
    /// Launches the browser. Also raises the default wait of every <c>Assertions.Expect</c> from Playwright's 5 s to 20 s:
    /// the tests run beside the other test projects on two cores, where a server round trip can take several seconds.
    /// </summary>
    public static Task<IBrowser> LaunchAsync(IPlaywright playwright)
    {
        Assertions.SetDefaultExpectTimeout(20_000);
        return Launch(playwright);
    }

    private static Task<IBrowser> Launch(IPlaywright playwright) => playwright.Chromium.LaunchAsync(new BrowserTypeLaunchOptions
    {
        ExecutablePath = "/usr/bin/chromium",
        Headless = true,
        Args = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
    });
}
