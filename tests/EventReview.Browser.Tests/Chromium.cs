using Microsoft.Playwright;

namespace EventReview.Browser.Tests;

/// <summary>Debian's Chromium, headless, with the flags that work on this machine (never Playwright's own download).</summary>
public static class Chromium
{
    public static Task<IBrowser> LaunchAsync(IPlaywright playwright) => playwright.Chromium.LaunchAsync(new BrowserTypeLaunchOptions
    {
        ExecutablePath = "/usr/bin/chromium",
        Headless = true,
        Args = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"],
    });
}
