using Bunit;
using EventReview.Core.Verdicts;
using EventReview.Web.Components.Shared;
using MudBlazor;

namespace EventReview.Web.Tests.Components.Shared;

public sealed class VerdictChipTests : MudTestContext
{
    public static TheoryData<string, string, string> Verdicts() => new()
    {
        { "consistent", "verdict-good", Icons.Material.Filled.CheckCircle },
        { "clear", "verdict-good", Icons.Material.Filled.CheckCircle },
        { VerdictWords.Word(Verdict.NothingAdded), "verdict-good", Icons.Material.Filled.CheckCircle },
        { "inconsistent", "verdict-bad", Icons.Material.Filled.Cancel },
        { VerdictWords.Word(Verdict.SomethingAdded), "verdict-bad", Icons.Material.Filled.Cancel },
        { "concern", "verdict-attention", Icons.Material.Filled.ReportProblem },
        { "stale", "verdict-attention", Icons.Material.Filled.ReportProblem },
        { "not run", "verdict-none", Icons.Material.Outlined.HelpOutline },
        { "anything else", "verdict-none", Icons.Material.Outlined.HelpOutline },
    };

    [Theory]
    [MemberData(nameof(Verdicts))]
    public void A_verdict_shows_its_word_and_an_icon_for_its_kind(string word, string css, string icon)
    {
        var cut = Render<VerdictChip>(p => p.Add(x => x.Word, word));

        var chip = cut.Find("span.verdict");
        Assert.Equal(word, chip.TextContent.Trim());
        Assert.Contains(css, chip.ClassList);
        Assert.Equal(PathsOf(icon), PathsOf(chip.QuerySelector("svg")!.InnerHtml));
    }

    [Fact]
    public void Good_bad_and_attention_verdicts_have_different_icons()
    {
        var paths = new[] { "consistent", "inconsistent", "concern", "not run" }
            .Select(w => string.Join('|', PathsOf(Render<VerdictChip>(p => p.Add(x => x.Word, w)).Find("svg").InnerHtml)))
            .ToList();

        Assert.Equal(4, paths.Distinct().Count());
    }
}
