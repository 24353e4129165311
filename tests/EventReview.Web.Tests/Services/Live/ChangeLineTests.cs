using EventReview.Web.Services.Live;
using EventReview.Web.Tests.Components;

namespace EventReview.Web.Tests.Services.Live;

public sealed class ChangeLineTests
{
    [Fact]
    public void The_lines_since_a_sequence_are_the_others_changes_newest_first_with_the_item_title()
    {
        var c = ComponentCases.Mixed();
        var newest = ChangeLine.Newest(c);

        var others = ChangeLine.Since(c, 0, ComponentCases.ReviewerA.UserId);

        Assert.NotEmpty(others);
        Assert.All(others, l => Assert.NotEqual(ComponentCases.ReviewerA.DisplayName, l.Who));
        Assert.Equal(others.OrderByDescending(l => l.Sequence).Select(l => l.Sequence), others.Select(l => l.Sequence));
        Assert.Equal(c.Timeline.Count(a => a.Sequence > newest - 2 && a.ActorId != "nobody"), ChangeLine.Since(c, newest - 2, "nobody").Count);
        Assert.Empty(ChangeLine.Since(c, newest, "nobody"));
    }

    [Fact]
    public void Each_kind_of_change_reads_as_a_short_phrase_naming_who_and_the_item()
    {
        var c = ComponentCases.Mixed();
        var everyone = ChangeLine.Since(c, 0, "nobody");

        var signed = everyone.First(l => l.What == "signed");
        Assert.Equal((ComponentCases.ReviewerB.DisplayName, "beta.three", "Third beta"), (signed.Who, signed.ItemKey, signed.ItemTitle));
        Assert.Contains(everyone, l => l.What == "added a note to" && l.ItemKey == "beta.one");
        Assert.Contains(everyone, l => l.What == "changed evidence, which made the sign-offs stale on" && l.ItemKey == "beta.one");
        Assert.Contains(everyone, l => l.What == "changed the state of" && l.ItemKey == "beta.two");
        Assert.Contains(everyone, l => l.What == "changed the owner of" && l.ItemKey == "alpha.two");
        Assert.All(everyone, l => Assert.False(string.IsNullOrWhiteSpace(l.What)));
        Assert.Equal(c.Timeline.Max(a => a.Sequence), ChangeLine.Newest(c));
    }
}
