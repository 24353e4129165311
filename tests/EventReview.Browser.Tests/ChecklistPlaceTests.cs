using Microsoft.Playwright;

namespace EventReview.Browser.Tests;

/// <summary>
/// Not getting lost in the checklist at 1440×900: an item opened by its address is highlighted, scrolled into view and
/// focused with a visible ring; j/k move and keep it in view; ? lists the keys; a click in the list keeps the page where it
/// is; back and forward restore the scroll position; a filter that keeps nothing offers "Clear filters".
/// </summary>
public sealed class ChecklistPlaceTests(RunningApp app) : IClassFixture<RunningApp>
{
    private const string CaseId = "ER-C-0142";

    private static readonly string Screenshots = Path.Combine(AppContext.BaseDirectory, "screenshots");

    [Fact]
    public async Task The_selected_item_is_highlighted_in_view_and_focused_and_the_list_keeps_its_place()
    {
        Directory.CreateDirectory(Screenshots);
        using var playwright = await Playwright.CreateAsync();
        await using var browser = await Chromium.LaunchAsync(playwright);
        var context = await browser.NewContextAsync(new BrowserNewContextOptions { ViewportSize = new ViewportSize { Width = 1440, Height = 900 } });
        context.SetDefaultTimeout(30_000);
        var page = await context.NewPageAsync();
        try
        {
            await page.GotoAsync($"{app.BaseUrl}/signin");
            await page.Locator("#email").FillAsync("coordinator@demo.invalid");
            await page.Locator("#password").FillAsync("DemoCoordinator1");
            await page.GetByRole(AriaRole.Button, new() { Name = "Sign in" }).ClickAsync();
            await page.WaitForURLAsync("**/cases");
            await page.GetByRole(AriaRole.Link, new() { Name = CaseId }).ClickAsync();
            await page.WaitForURLAsync("**/cases/*");
            var caseUrl = new Uri(page.Url).AbsolutePath.TrimEnd('/');

            // By address: an item far down the list is highlighted, scrolled into view and its link has the (visible) focus.
            await page.GotoAsync($"{app.BaseUrl}{caseUrl}/items/env.coupling");
            await page.Locator("#interactive-ready").WaitForAsync(new() { State = WaitForSelectorState.Attached });
            await Assertions.Expect(page.Locator("li.selected")).ToHaveAttributeAsync("data-item", "env.coupling");
            await Assertions.Expect(page.Locator("li.selected a")).ToHaveAttributeAsync("aria-current", "true");
            await Assertions.Expect(page.Locator("li.selected a")).ToBeFocusedAsync();
            await Assertions.Expect(page.Locator("li.selected")).ToBeInViewportAsync(new() { Ratio = 1 });
            Assert.True(await page.EvaluateAsync<bool>("() => document.activeElement.matches(':focus-visible') && getComputedStyle(document.activeElement).outlineStyle !== 'none'"),
                "The focused item link shows no focus ring.");

            // Keys: j and k move the selection (and the address), the new row stays in view and takes the focus.
            await page.Keyboard.PressAsync("j");
            await page.WaitForURLAsync("**/items/env.cross-site");
            await Assertions.Expect(page.Locator("li.selected")).ToHaveAttributeAsync("data-item", "env.cross-site");
            await Assertions.Expect(page.Locator("li.selected a")).ToBeFocusedAsync();
            await page.Keyboard.PressAsync("j");
            await page.WaitForURLAsync("**/items/chain.stages");
            await Assertions.Expect(page.Locator("li.selected")).ToBeInViewportAsync(new() { Ratio = 1 });
            await page.Keyboard.PressAsync("k");
            await page.WaitForURLAsync("**/items/env.cross-site");
            await Assertions.Expect(page.Locator("li.selected a")).ToBeFocusedAsync();
            await page.Keyboard.PressAsync("?");
            await Assertions.Expect(page.Locator("#keys-help")).ToBeVisibleAsync();
            foreach (var key in new[] { "j", "k", "Enter", "?" })
            {
                await Assertions.Expect(page.Locator("#keys-help")).ToContainTextAsync(key);
            }

            await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, "checklist-keys.png") });

            // The list itself takes the focus from the keyboard, with a ring.
            await page.Locator("#checklist-keys").FocusAsync();
            Assert.NotEqual("none", await page.EvaluateAsync<string>("() => getComputedStyle(document.activeElement).outlineStyle"));

            // A click in the list keeps the page where it is (no jump to the top); the panel stays beside the list.
            await page.EvaluateAsync("() => window.scrollTo(0, 900)");
            await page.WaitForTimeoutAsync(300);
            var target = page.Locator("li[data-item='timing.arrival'] a");
            if (!await target.IsVisibleAsync() || (await target.BoundingBoxAsync())!.Y > 800 || (await target.BoundingBoxAsync())!.Y < 80)
            {
                await page.EvaluateAsync("() => { const r = document.querySelector(\"li[data-item='timing.arrival']\").getBoundingClientRect(); window.scrollBy(0, r.top - 400); }");
                await page.WaitForTimeoutAsync(300);
            }

            var before = await page.EvaluateAsync<double>("() => window.scrollY");
            Assert.True(before > 300, $"The list should be scrolled down before the click (scrollY {before}).");
            await target.ClickAsync();
            await page.WaitForURLAsync("**/items/timing.arrival");
            await Assertions.Expect(page.Locator("#item-title")).ToBeInViewportAsync();
            await page.WaitForTimeoutAsync(500);
            Assert.InRange(await page.EvaluateAsync<double>("() => window.scrollY"), before - 2, before + 2);
            await Assertions.Expect(page.Locator("li.selected")).ToHaveAttributeAsync("data-item", "timing.arrival");

            // Back and forward: each address gets its own scroll position back.
            await page.EvaluateAsync("() => window.scrollTo(0, 200)");
            await page.WaitForTimeoutAsync(400);
            await page.GoBackAsync();
            await page.WaitForURLAsync("**/items/env.cross-site");
            await page.WaitForTimeoutAsync(800);
            Assert.InRange(await page.EvaluateAsync<double>("() => window.scrollY"), before - 2, before + 2);
            await page.GoForwardAsync();
            await page.WaitForURLAsync("**/items/timing.arrival");
            await page.WaitForTimeoutAsync(800);
            Assert.InRange(await page.EvaluateAsync<double>("() => window.scrollY"), 198, 202);

            // A filter that keeps nothing (the fresh demo has no stale sign-off) says so and offers to clear it.
            await page.GotoAsync($"{app.BaseUrl}{caseUrl}/items/env.coupling?show=stale");
            await page.Locator("#interactive-ready").WaitForAsync(new() { State = WaitForSelectorState.Attached });
            await Assertions.Expect(page.Locator("#checklist-empty")).ToContainTextAsync("No items are stale sign-offs");
            await Assertions.Expect(page.Locator("li[data-item]")).ToHaveCountAsync(0);
            await page.Locator("#clear-checklist-filters").ClickAsync();
            await page.WaitForURLAsync("**/items/env.coupling");
            await Assertions.Expect(page.Locator("li[data-item]")).ToHaveCountAsync(36);
            await Assertions.Expect(page.Locator("#checklist-filter a.on")).ToHaveAttributeAsync("data-show", "all");
        }
        catch
        {
            await page.ScreenshotAsync(new() { Path = Path.Combine(Screenshots, "checklist-place-failure.png") });
            throw;
        }
    }
}
