using Bunit;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Web.Components.Shared;
using MudBlazor;

namespace EventReview.Web.Tests.Components.Shared;

public sealed class StateChipTests : MudTestContext
{
    public static TheoryData<ItemState, string, string, string> ItemStates() => new()
    {
        { ItemState.Open, "open", "state-open", Icons.Material.Outlined.Circle },
        { ItemState.InProgress, "in progress", "state-in-progress", Icons.Material.Filled.Pending },
        { ItemState.ReadyForSignOff, "ready for sign-off", "state-ready-for-sign-off", Icons.Material.Filled.HowToReg },
        { ItemState.SignedOff, "signed off", "state-signed-off", Icons.Material.Filled.Verified },
    };

    [Theory]
    [MemberData(nameof(ItemStates))]
    public void An_item_state_shows_its_word_and_its_own_icon(ItemState state, string word, string css, string icon)
    {
        var cut = Render<StateChip>(p => p.Add(x => x.Item, state));

        var chip = cut.Find("span.state");
        Assert.Equal(word, chip.TextContent.Trim());
        Assert.Equal(word, chip.GetAttribute("title"));
        Assert.Contains(css, chip.ClassList);
        Assert.Equal(PathsOf(icon), PathsOf(chip.QuerySelector("svg")!.InnerHtml));
    }

    public static TheoryData<CaseState, CaseOutcome?, string, string, string> CaseStates() => new()
    {
        { CaseState.Open, null, "open", "state-open", Icons.Material.Outlined.FolderOpen },
        { CaseState.InReview, null, "in review", "state-in-review", Icons.Material.Filled.FactCheck },
        { CaseState.AwaitingDecision, null, "awaiting decision", "state-awaiting-decision", Icons.Material.Filled.Gavel },
        { CaseState.Closed, CaseOutcome.Instrumental, "closed: instrumental", "state-closed", Icons.Material.Filled.Lock },
        { CaseState.Closed, CaseOutcome.Astrophysical, "closed: astrophysical", "state-closed", Icons.Material.Filled.Lock },
    };

    [Theory]
    [MemberData(nameof(CaseStates))]
    public void A_case_state_shows_its_word_with_the_outcome_when_closed_and_its_icon(CaseState state, CaseOutcome? outcome, string word, string css, string icon)
    {
        var cut = Render<StateChip>(p => p.Add(x => x.Case, state).Add(x => x.Outcome, outcome));

        var chip = cut.Find("span.state");
        Assert.Equal(word, chip.TextContent.Trim());
        Assert.Contains(css, chip.ClassList);
        Assert.Equal(PathsOf(icon), PathsOf(chip.QuerySelector("svg")!.InnerHtml));
    }

    [Fact]
    public void Every_item_state_has_a_different_icon()
    {
        var icons = Enum.GetValues<ItemState>()
            .Select(s => string.Join('|', PathsOf(Render<StateChip>(p => p.Add(x => x.Item, s)).Find("svg").InnerHtml)))
            .ToList();

        Assert.Equal(icons.Count, icons.Distinct().Count());
        Assert.All(icons, i => Assert.NotEqual(string.Empty, i));
    }
}
