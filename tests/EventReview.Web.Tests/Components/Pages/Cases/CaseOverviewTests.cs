using System.Globalization;
using Bunit;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Time;
using EventReview.Core.Timing;
using EventReview.Web.Components.Pages.Cases;

namespace EventReview.Web.Tests.Components.Pages.Cases;

public sealed class CaseOverviewTests : MudTestContext
{
    // Invented four-site geometry (letters-only codes), 0.5 ms timing uncertainty each.
    private static readonly Site[] Sites =
    [
        new("PA", "Pale Anchor", 52.0, 8.0, 100, 10, 100, 5e-4),
        new("QB", "Quiet Bay", -31.0, 118.0, 20, 45, 135, 5e-4),
        new("RC", "Red Cedar", 38.0, -98.0, 400, 300, 30, 5e-4),
        new("SD", "Salt Dune", 5.0, 30.0, 600, 70, 160, 5e-4),
    ];

    private static void AddTiming(ReviewCase c, string resultJson, string verdict, string summary) =>
        c.AddComputation("beta.one", new ComputationRecord("timing", "{}", "f", "v", resultJson, verdict, summary, string.Empty, ComponentCases.ReviewerA,
            ComponentCases.Opened.AddHours(1)), ComponentCases.ReviewerA, ComponentCases.Opened.AddHours(1));

    private IRenderedComponent<CaseOverview> RenderOverview(ReviewCase c, Action<string>? onSelect = null) =>
        Render<CaseOverview>(p =>
        {
            p.Add(x => x.Case, c);
            if (onSelect is not null)
            {
                p.Add(x => x.OnSelect, onSelect);
            }
        });

    [Fact]
    public void Sections_are_rows_checks_are_columns_and_each_item_is_one_chip_linking_to_it()
    {
        var c = ComponentCases.Mixed();
        string? selected = null;

        var cut = RenderOverview(c, key => selected = key);

        Assert.Equal(["timing"], cut.FindAll("#overview-matrix thead th[data-kind]").Select(th => th.GetAttribute("data-kind")));
        Assert.Equal(["alpha", "beta"], cut.FindAll("#overview-matrix tbody tr").Select(tr => tr.GetAttribute("data-section")));
        Assert.Empty(cut.FindAll("tr[data-section='alpha'] a.matrix-chip"));
        var chip = cut.Find("tr[data-section='beta'] td[data-kind='timing'] a.matrix-chip");
        Assert.Equal("beta.one", chip.GetAttribute("data-item"));
        Assert.Equal("/cases/" + c.Id + "/items/beta.one", chip.GetAttribute("href"));
        Assert.Equal("not run", chip.QuerySelector(".verdict")!.TextContent.Trim());
        Assert.Equal(["1 / 2", "1 / 3"], cut.FindAll("#overview-matrix tbody tr").Select(tr => tr.QuerySelectorAll("td.num")[0].TextContent.Trim()));

        chip.Click();
        Assert.Equal("beta.one", selected);
    }

    [Fact]
    public void Stale_sign_offs_and_what_blocks_closing_are_listed_beside_the_matrix()
    {
        var cut = RenderOverview(ComponentCases.Mixed());

        Assert.Contains("First beta", cut.Find("#overview-stale").TextContent, StringComparison.Ordinal);
        var blockers = cut.FindAll("#overview-blockers li").Select(li => li.TextContent).ToList();
        Assert.Contains(blockers, b => b.StartsWith("3 of 5 items not signed off", StringComparison.Ordinal));
        Assert.Contains("1 item(s) with stale sign-offs to sign again", blockers);
        Assert.Contains("1 built-in check(s) not run yet", blockers);
    }

    [Fact]
    public void The_timing_headline_is_read_from_the_record_with_its_chi_square_and_degrees_of_freedom()
    {
        var c = ComponentCases.Mixed();
        var t0 = GpsTime.FromSeconds(1400000000m);
        var arrivals = NetworkProjection.Project(Sites, SkyFrame.ToEcef(150, 20, 0), 0).Select(p => new SiteArrival(p.Code, t0.AddSeconds(p.DelaySeconds))).ToArray();
        var result = TimingReview.Run(Sites, arrivals, new TimingCheckParameters());
        AddTiming(c, CheckRecords.Serialize(result), result.Judgement!.Word, result.Summary);

        var cut = RenderOverview(c);

        var headlines = cut.Find("#overview-headlines").TextContent;
        Assert.Contains("sky-fit χ² = " + result.Timing.Chi2!.Value.ToString("0.##", CultureInfo.InvariantCulture) + " with " + result.Timing.DegreesOfFreedom, headlines, StringComparison.Ordinal);
        Assert.Contains("no item of this checklist runs this check", headlines, StringComparison.Ordinal); // no overlap item here: said, not left blank
        Assert.Equal(result.Judgement.Word, cut.Find("a.matrix-chip .verdict").TextContent.Trim());
        Assert.Contains(result.Summary, cut.Find("a.matrix-chip").GetAttribute("title"), StringComparison.Ordinal);
    }

    [Fact]
    public void An_unreadable_result_is_said_and_its_stored_verdict_still_shown()
    {
        // Adversarial: a record whose JSON cannot be read must not drop out of the overview, leaving only the good news.
        var c = ComponentCases.Mixed();
        AddTiming(c, "{\"timing\": [not json", "inconsistent", "pairs disagree");

        var cut = RenderOverview(c);

        Assert.Equal("inconsistent", cut.Find("a.matrix-chip .verdict").TextContent.Trim());
        Assert.Contains("the stored result could not be read", cut.Find("#overview-headlines").TextContent, StringComparison.Ordinal);
    }

    [Fact]
    public void A_long_check_name_may_break_at_a_soft_hyphen_and_keeps_its_full_name_as_title()
    {
        var template = new ChecklistTemplate
        {
            Name = "header-test",
            Title = "Header test",
            Sections =
            [
                new TemplateSection
                {
                    Key = "alpha", Title = "Alpha checks",
                    Items =
                    [
                        new TemplateItem { Key = "alpha.one", Title = "Frozen", Guidance = "g", Check = CheckKind.Configuration },
                        new TemplateItem { Key = "alpha.two", Title = "Timed", Guidance = "g", Check = CheckKind.Timing },
                    ],
                },
            ],
        };
        ChecklistTemplateLoader.Validate(template);
        var c = ReviewCase.Open("TC-UI-2", GpsTime.FromSeconds(1_400_000_000m), "s", "", [], template, ComponentCases.Coordinator, ComponentCases.Opened);

        var cut = RenderOverview(c);

        var configuration = cut.Find("#overview-matrix thead th[data-kind='configuration']");
        Assert.Equal("configuration", configuration.GetAttribute("title"));
        Assert.Equal("configu\u00ADration", configuration.TextContent.Trim());
        Assert.Equal("timing", cut.Find("#overview-matrix thead th[data-kind='timing']").TextContent.Trim());
    }
}
