using EventReview.Core.Live;

namespace EventReview.Core.Tests.Live;

public sealed class PresenceBoardTests
{
    private static readonly DateTimeOffset T0 = new(2026, 5, 1, 9, 0, 0, TimeSpan.Zero);

    private static PresenceBeat Ben(string? item = "3.2", string? doing = null, bool leaving = false) =>
        new("DEMO-1", "s-ben", "u-ben", "Ben Example", item, doing, leaving);

    [Fact]
    public void An_arrival_a_move_and_a_new_activity_are_changes_but_a_renewal_is_not()
    {
        var board = new PresenceBoard();

        Assert.True(board.Apply(Ben(), T0));
        Assert.False(board.Apply(Ben(), T0.AddSeconds(10)));
        Assert.True(board.Apply(Ben(doing: "editing a note"), T0.AddSeconds(11)));
        Assert.True(board.Apply(Ben(item: "4.1"), T0.AddSeconds(12)));
        Assert.Equal("4.1", Assert.Single(board.Here("DEMO-1", T0.AddSeconds(12))).ItemKey);
    }

    [Fact]
    public void A_page_that_stops_beating_is_gone_after_the_expiry_and_counts_as_an_arrival_when_it_comes_back()
    {
        var board = new PresenceBoard();
        board.Apply(Ben(), T0);

        Assert.Single(board.Here("DEMO-1", T0 + PresenceBoard.Expiry));
        Assert.Empty(board.Here("DEMO-1", T0 + PresenceBoard.Expiry + TimeSpan.FromMilliseconds(1)));
        Assert.True(board.Apply(Ben(), T0.AddMinutes(5)));
    }

    [Fact]
    public void Leaving_removes_only_that_page_and_other_cases_are_not_shown()
    {
        var board = new PresenceBoard();
        board.Apply(Ben(), T0);
        board.Apply(Ben() with { SessionId = "s-ben-2", ItemKey = null }, T0);
        board.Apply(new PresenceBeat("OTHER-9", "s-ana", "u-ana", "Ana Example", null, null), T0);

        Assert.True(board.Apply(Ben(leaving: true), T0.AddSeconds(1)));
        Assert.False(board.Apply(Ben(leaving: true), T0.AddSeconds(2)));

        var here = Assert.Single(board.Here("DEMO-1", T0.AddSeconds(2)));
        Assert.Equal("s-ben-2", here.SessionId);
    }
}
