using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Tests.Signal;

namespace EventReview.Core.Tests.Plots.Figures;

public class OverlapFiguresTests
{
    private static OverlapResult Result(int offSource = 0)
    {
        var sim = SimulatedPair.Make(7, snr: 30);
        return OverlapCheck.Run(SimulatedPair.A(sim), SimulatedPair.B(sim), new OverlapOptions(SimulatedPair.Coalescence(), 0.2, SimulatedPair.MaxLagSeconds, OffSourceCount: offSource));
    }

    [Fact]
    public void The_overlay_names_the_alignment_in_our_own_words_with_units()
    {
        var fig = OverlapFigures.Overlay(Result(), "KX", "MV");
        var labels = fig.Elements.Select(e => e.Label).OfType<string>().ToList();
        Assert.Contains(labels, l => l.StartsWith("MV aligned: arrival offset ", StringComparison.Ordinal) && l.Contains(" ms", StringComparison.Ordinal));
        Assert.DoesNotContain(labels, l => l.Contains("flipped", StringComparison.OrdinalIgnoreCase) || l.Contains("shifted", StringComparison.OrdinalIgnoreCase));
        Assert.Contains("(ms)", fig.X.Label);
        Assert.Contains("(dimensionless)", fig.Y.Label);
    }

    [Fact]
    public void The_histogram_counts_every_off_source_overlap_once()
    {
        var r = Result(60);
        var fig = OverlapFigures.OffSourceHistogram(r);
        var bars = Assert.Single(fig.Elements.OfType<PlotBand>());
        Assert.Equal(r.OffSourceOverlaps.Length, (int)Math.Round(bars.Upper.Sum() / 2));
        Assert.Contains("off-source overlaps", fig.Caption);
    }

    [Fact]
    public void Without_off_source_windows_the_histogram_says_so()
    {
        Assert.StartsWith("No off-source overlaps were computed", OverlapFigures.OffSourceHistogram(Result()).Caption);
    }
}
