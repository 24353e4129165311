using System.Security.Claims;
using Bunit;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Web.Components.Pages.Cases;
using EventReview.Web.Services;
using EventReview.Web.Tests.Fixtures;

namespace EventReview.Web.Tests.Components.Pages.Cases;

/// <summary>
/// The item panel over a real app: it offers the actions the reader's role allows, hands every change to the workflow
/// and shows what came back; signing with a wrong password is refused by the workflow (the panel no longer checks).
/// </summary>
public sealed class ItemPanelTests(EventReviewFactory app) : AppBackedContext(app), IClassFixture<EventReviewFactory>
{
    private static readonly ClaimsPrincipal Coordinator = Principals.Coordinator("u-coord-panel", "Coordinator Pia");
    private static readonly ClaimsPrincipal Owner = Principals.Reviewer("u-rev-panel-a", "Reviewer Per");
    private static readonly ClaimsPrincipal Signer = Principals.Reviewer("u-rev-panel-b", "Reviewer Quin");
    private const string Key = "triage.timing";
    private static readonly TimeSpan Wait = TimeSpan.FromSeconds(30); // a shared machine; the workflow writes to a real database

    private readonly List<ReviewCase> _changed = [];

    private async Task<ReviewCase> OpenAsync()
    {
        var gps = 1_400_000_000.125m;
        return (await Get<CaseWorkflow>().OpenAsync(Coordinator, new OpenCaseRequest(ApiCalls.NewCandidateId(), gps, "test-search", "Item panel test.",
            [new ArrivalRequest("KP", gps + 0.004m, 9.5), new ArrivalRequest("AB", gps - 0.002m, 7.0)], "rapid-triage"))).Case;
    }

    private IRenderedComponent<ItemPanel> RenderPanel(ReviewCase c, ClaimsPrincipal user) =>
        Render<ItemPanel>(p => p.Add(x => x.Case, c).Add(x => x.Item, c.Item(Key)).Add(x => x.User, user).Add(x => x.OnChanged, updated => _changed.Add(updated)));

    [Fact]
    public async Task Ready_for_sign_off_goes_through_the_workflow_and_hands_back_the_changed_case()
    {
        var c = await OpenAsync();
        c = await Get<EvidenceAppender>().AddNoteAsync(Owner, c.Id, Key, "Delays checked.");
        var panel = RenderPanel(c, Owner);

        panel.Find("#mark-ready").Click();

        panel.WaitForAssertion(() => Assert.Equal(ItemState.ReadyForSignOff, Assert.Single(_changed).Item(Key).State), Wait);
        Assert.Equal(ItemState.ReadyForSignOff, (await Get<CaseQueries>().GetAsync(Coordinator, c.Id)).Item(Key).State);
        Assert.Empty(panel.FindAll(".mud-alert-text-error, .mud-alert-filled-error"));
    }

    [Fact]
    public async Task Ready_for_sign_off_without_evidence_is_refused_with_the_workflows_reason_and_nothing_changes()
    {
        var c = await OpenAsync();
        var panel = RenderPanel(c, Owner);

        panel.Find("#mark-ready").Click();

        panel.WaitForAssertion(() => Assert.NotEmpty(panel.FindAll(".mud-alert-message")), Wait);
        Assert.Contains("evidence", panel.Find(".mud-alert-message").TextContent, StringComparison.OrdinalIgnoreCase);
        Assert.Empty(_changed);
        Assert.Equal(ItemState.Open, (await Get<CaseQueries>().GetAsync(Coordinator, c.Id)).Item(Key).State);
    }

    [Fact]
    public async Task An_observer_is_offered_no_action_and_no_sign_off_form()
    {
        var c = await OpenAsync();
        await Get<EvidenceAppender>().AddNoteAsync(Owner, c.Id, Key, "Delays checked.");
        c = await Get<CaseWorkflow>().TransitionAsync(Owner, c.Id, Key, "ready", null);

        var panel = RenderPanel(c, Principals.Make("u-observer-panel", "Observer Ola", EventReview.Data.Auth.Roles.Observer));

        Assert.Empty(panel.FindAll("#mark-ready"));
        Assert.Empty(panel.FindAll("#sign-button"));
        Assert.Contains("Delays checked.", panel.Markup, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_wrong_password_is_refused_by_the_workflow_the_panel_says_so_and_nothing_is_signed()
    {
        var c = await OpenAsync();
        await Get<EvidenceAppender>().AddNoteAsync(Owner, c.Id, Key, "Delays checked.");
        c = await Get<CaseWorkflow>().TransitionAsync(Owner, c.Id, Key, "ready", null);
        await Signers.ProofAsync(App.Services, Signer);
        var panel = RenderPanel(c, Signer);

        panel.Find("#sign-statement").Change("Read the delays myself.");
        panel.Find("#sign-password").Change("not-my-password-1");
        panel.Find("#sign-button").Click();

        panel.WaitForAssertion(() => Assert.Contains("password is not correct", panel.Markup, StringComparison.Ordinal), Wait);
        Assert.Empty(_changed);
        Assert.Empty((await Get<CaseQueries>().GetAsync(Coordinator, c.Id)).Item(Key).SignOffs);

        panel.Find("#sign-password").Change(Signers.Password);
        panel.Find("#sign-button").Click();
        panel.WaitForAssertion(() => Assert.Single(Assert.Single(_changed).Item(Key).SignOffs), Wait);
        panel.WaitForAssertion(() => Assert.Contains("Signed.", panel.Markup, StringComparison.Ordinal));
    }

    [Fact]
    public async Task The_items_timeline_lists_its_entries_newest_first()
    {
        var c = await OpenAsync();
        await Get<EvidenceAppender>().AddNoteAsync(Owner, c.Id, Key, "First.");
        c = await Get<CaseWorkflow>().TransitionAsync(Owner, c.Id, Key, "ready", null);

        var panel = RenderPanel(c, Owner);

        var entries = panel.FindAll("ul.item-timeline li").Select(li => li.TextContent).ToList();
        Assert.Equal(c.Timeline.Count(a => a.ItemKey == Key), entries.Count);
        Assert.Contains("ready", entries[0], StringComparison.OrdinalIgnoreCase);
        Assert.Contains("<h3>Timeline</h3>", panel.Markup, StringComparison.Ordinal); // one word for the record: API, dossier and panel
        Assert.DoesNotContain("History", panel.Markup, StringComparison.Ordinal);
    }
}
