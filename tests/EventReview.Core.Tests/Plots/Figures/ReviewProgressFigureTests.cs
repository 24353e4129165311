using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;

namespace EventReview.Core.Tests.Plots.Figures;

public class ReviewProgressFigureTests
{
    private static readonly long Open = new DateTime(2026, 3, 1, 8, 0, 0, DateTimeKind.Utc).Ticks;

    private static long H(double hours) => Open + (long)(hours * TimeSpan.TicksPerHour);

    [Fact]
    public void An_item_counts_as_signed_only_while_it_has_its_required_current_sign_offs()
    {
        ReviewProgressItem[] items =
        [
            new(2, [new(H(1), null), new(H(3), null)]),
            new(1, [new(H(2), H(5))]),
            new(0, []),
        ];
        Assert.Equal(0, ReviewProgressFigure.SignedAt(items, H(1.5)));
        Assert.Equal(1, ReviewProgressFigure.SignedAt(items, H(2)));
        Assert.Equal(2, ReviewProgressFigure.SignedAt(items, H(3)));
        Assert.Equal(1, ReviewProgressFigure.SignedAt(items, H(5)));
    }

    [Fact]
    public void Stale_sign_offs_pull_the_signed_line_down_while_the_count_of_sign_offs_keeps_rising()
    {
        // The reassuring statistic, sign-offs given, only ever rises; the signed-items line must show the drop when evidence changed.
        ReviewProgressItem[] items = [new(1, [new(H(1), H(4))]), new(1, [new(H(2), H(4)), new(H(6), null)])];
        var fig = ReviewProgressFigure.Build(items, Open, H(8));
        var signed = fig.Elements.OfType<PlotLine>().Single(l => l.Label!.StartsWith("items fully signed", StringComparison.Ordinal));
        var given = fig.Elements.OfType<PlotLine>().Single(l => l.Label!.StartsWith("sign-offs given", StringComparison.Ordinal));
        Assert.Equal(2, signed.Ys.Max());
        Assert.Equal(1, signed.Ys[^1]);
        Assert.Equal(3, given.Ys[^1]);
        Assert.True(given.Ys.Zip(given.Ys.Skip(1)).All(p => p.Second >= p.First));
        Assert.Equal("time since the case was opened (hours)", fig.X.Label);
        Assert.Equal(8, fig.X.Max, 9);
        Assert.Contains("1 of 2 items fully signed", fig.Caption);
        FigureBackEndTests.AssertDrawable(fig);
    }

    [Fact]
    public void A_long_review_is_drawn_in_days()
    {
        var fig = ReviewProgressFigure.Build([new(1, [new(H(30), null)])], Open, H(24 * 10));
        Assert.Equal("time since the case was opened (days)", fig.X.Label);
        Assert.Equal(10, fig.X.Max, 9);
    }
}
