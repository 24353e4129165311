using Bunit;
using EventReview.Web.Components.Shared;

namespace EventReview.Web.Tests.Components.Shared;

public sealed class ChecklistViewTests : MudTestContext
{
    private readonly Core.Cases.ReviewCase _case = ComponentCases.Mixed();

    private IRenderedComponent<ChecklistView> RenderView(string? selected = null, DateOnly? today = null, Action<string>? onSelect = null) =>
        Render<ChecklistView>(p =>
        {
            p.Add(x => x.Items, _case.Items);
            p.Add(x => x.CaseId, 42);
            p.Add(x => x.SelectedKey, selected);
            p.Add(x => x.Today, today ?? new DateOnly(2026, 3, 1));
            if (onSelect is not null)
            {
                p.Add(x => x.OnSelect, onSelect);
            }
        });

    [Fact]
    public void Sections_appear_in_template_order_with_signed_over_total_progress()
    {
        var cut = RenderView();

        var sections = cut.FindAll("section.checklist-section");
        Assert.Equal(["alpha", "beta"], sections.Select(s => s.GetAttribute("data-section")));
        Assert.Equal(["Alpha checks", "Beta checks"], sections.Select(s => s.QuerySelector("h3")!.TextContent.Trim()));
        Assert.Equal(["1 / 2 signed", "1 / 3 signed"], sections.Select(s => s.QuerySelector(".section-progress")!.TextContent.Trim()));
    }

    [Fact]
    public void Items_appear_in_order_within_their_section_with_links_that_hold_case_and_item()
    {
        var cut = RenderView();

        var beta = cut.Find("section[data-section='beta']");
        Assert.Equal(["beta.one", "beta.two", "beta.three"], beta.QuerySelectorAll("li").Select(li => li.GetAttribute("data-item")));
        Assert.Equal("/cases/42/items/beta.two", cut.Find("li[data-item='beta.two'] a").GetAttribute("href"));
        Assert.Equal("Second beta", cut.Find("li[data-item='beta.two'] .item-title").TextContent);
    }

    [Fact]
    public void Each_item_shows_its_state_sign_offs_owner_and_check_kind()
    {
        var cut = RenderView();

        Assert.Contains("signed off", cut.Find("li[data-item='alpha.one'] .state").TextContent, StringComparison.Ordinal);
        Assert.Contains("in progress", cut.Find("li[data-item='beta.two'] .state").TextContent, StringComparison.Ordinal);
        Assert.Contains("ready for sign-off", cut.Find("li[data-item='beta.one'] .state").TextContent, StringComparison.Ordinal);
        Assert.Equal("1/1 sign-offs", cut.Find("li[data-item='alpha.one'] .signoffs").TextContent.Trim());
        Assert.Equal("0/1 sign-offs", cut.Find("li[data-item='beta.one'] .signoffs").TextContent.Trim());
        Assert.Equal("Reviewer Ada", cut.Find("li[data-item='alpha.two'] .owner").TextContent);
        Assert.Equal("unassigned", cut.Find("li[data-item='beta.two'] .owner").TextContent);
        Assert.Equal("timing", cut.Find("li[data-item='beta.one'] .check-kind").TextContent);
        Assert.Empty(cut.FindAll("li[data-item='beta.two'] .check-kind"));
    }

    [Fact]
    public void Only_the_selected_item_is_marked_selected()
    {
        var cut = RenderView(selected: "beta.one");

        Assert.Equal(["beta.one"], cut.FindAll("li.selected").Select(li => li.GetAttribute("data-item")));
        Assert.Equal(["/cases/42/items/beta.one"], cut.FindAll("a[aria-current='true']").Select(a => a.GetAttribute("href")));
    }

    [Fact]
    public void Nothing_is_marked_selected_without_a_selected_key()
    {
        Assert.Empty(RenderView().FindAll("li.selected"));
    }

    [Fact]
    public void An_unsigned_item_past_its_due_date_is_marked_overdue_and_a_signed_one_is_not()
    {
        var cut = RenderView(today: new DateOnly(2026, 3, 10));

        var overdue = cut.Find("li[data-item='alpha.two'] .due");
        Assert.Contains("overdue", overdue.ClassList);
        Assert.Equal("due 2026-03-04 (overdue)", overdue.TextContent.Trim());
        var signed = cut.Find("li[data-item='alpha.one'] .due");
        Assert.DoesNotContain("overdue", signed.ClassList);
        Assert.Equal("due 2026-03-02", signed.TextContent.Trim());
    }

    [Fact]
    public void An_item_is_not_overdue_on_its_due_date()
    {
        var cut = RenderView(today: new DateOnly(2026, 3, 4));

        Assert.DoesNotContain("overdue", cut.Find("li[data-item='alpha.two'] .due").ClassList);
        Assert.Empty(cut.FindAll(".overdue"));
    }

    [Fact]
    public void Only_an_item_with_stale_sign_offs_carries_the_stale_mark()
    {
        var cut = RenderView();

        var stale = cut.FindAll(".verdict").Where(v => v.TextContent.Contains("stale", StringComparison.Ordinal)).ToList();
        var marked = Assert.Single(stale);
        Assert.Equal("beta.one", marked.Closest("li")!.GetAttribute("data-item"));
    }

    [Fact]
    public void Clicking_an_item_reports_its_key()
    {
        var selected = new List<string>();
        var cut = RenderView(onSelect: selected.Add);

        cut.Find("li[data-item='beta.two'] a").Click();
        cut.Find("li[data-item='alpha.one'] a").Click();

        Assert.Equal(["beta.two", "alpha.one"], selected);
    }

    [Fact]
    public void An_empty_checklist_renders_no_sections()
    {
        var cut = Render<ChecklistView>(p => p.Add(x => x.Items, []));

        Assert.Empty(cut.FindAll("section"));
    }
}
