using System.Security.Claims;
using Bunit;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Web.Components.Checks;
using EventReview.Web.Demo;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;
using EventReview.Web.Tests.Fixtures;
using MudBlazor.Extensions;

namespace EventReview.Web.Tests.Components.Checks;

/// <summary>
/// The overlap run form over the demo case with its simulated strain: what it reads it hands to the parameter records,
/// and a field they refuse is named in the message, with no job started.
/// </summary>
public sealed class OverlapRunnerTests(EventReviewFactory app) : AppBackedContext(app), IClassFixture<EventReviewFactory>
{
    private static readonly ClaimsPrincipal Reviewer = Principals.Reviewer("u-rev-runner", "Reviewer Rune");

    private async Task<(ReviewCase Case, ChecklistItem Item)> DemoAsync()
    {
        var cases = Get<CaseQueries>();
        var id = (await cases.ListAsync(Reviewer, search: OverlapDemoStep.CandidateId)).Cases.Single(c => c.CandidateId == OverlapDemoStep.CandidateId).Id;
        var c = await cases.GetAsync(Reviewer, id);
        return (c, c.Item(OverlapDemoStep.ItemKey));
    }

    private async Task<IRenderedComponent<OverlapRunner>> RenderAsync()
    {
        var (c, item) = await DemoAsync();
        Render<MudBlazor.MudPopoverProvider>();
        return Render<OverlapRunner>(p => p.Add(x => x.Case, c).Add(x => x.Item, item).Add(x => x.User, Reviewer));
    }

    [Theory]
    [InlineData("Centre (GPS s)", "12:00", "Centre (GPS s): \"12:00\" is not a GPS time")]
    [InlineData("Notches (Hz)", "35, thirty", "Notches (Hz): \"thirty\" is not a frequency in Hz.")]
    public async Task A_field_that_cannot_be_read_is_named_and_no_job_starts(string label, string typed, string message)
    {
        var form = await RenderAsync();
        var jobs = Get<CheckJobs>();
        var key = CheckJobs.Key(form.Instance.Case.Id, OverlapDemoStep.ItemKey, CheckKind.Overlap);
        var before = jobs.Get(key);

        form.FindAll("div.mud-input-control").Single(d => d.TextContent.Contains(label, StringComparison.Ordinal)).QuerySelector("input")!.Change(typed);
        form.Find("#run-overlap").Click();

        form.WaitForAssertion(() => Assert.Contains(message, form.Find(".mud-alert-message").TextContent, StringComparison.Ordinal), TimeSpan.FromSeconds(30));
        Assert.Same(before, jobs.Get(key));
    }

    [Fact]
    public async Task The_form_offers_the_two_loudest_sites_and_their_strain_files_by_default()
    {
        var form = await RenderAsync();

        var selects = form.FindComponents<MudBlazor.MudSelect<string>>();
        Assert.Equal(
            form.Instance.Case.Arrivals.OrderByDescending(a => a.Snr).Take(2).Select(a => a.SiteCode),
            selects.Where(s => s.Instance.Label is "Site A" or "Site B").Select(s => s.Instance.GetState(x => x.Value)));
        Assert.Empty(form.FindAll(".mud-alert-message"));
    }
}
