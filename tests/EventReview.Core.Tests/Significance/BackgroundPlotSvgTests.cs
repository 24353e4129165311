using System.Globalization;
using System.Xml.Linq;
using EventReview.Core.Significance;
using EventReview.Core.Statistics;

namespace EventReview.Core.Tests.Significance;

public class BackgroundPlotSvgTests
{
    [Fact]
    public void The_plot_is_well_formed_svg_with_axes_sigma_levels_candidate_and_caption()
    {
        var rng = new Random(2);
        var a = TimeSlideBackgroundTests.PoissonSite("KX", rng, 0.3, 2e4);
        var b = TimeSlideBackgroundTests.PoissonSite("MV", rng, 0.3, 2e4);
        var result = TimeSlideBackground.Run(a, b, new TimeSlideOptions { WindowNs = 15_000_000, StepNs = 3_000_000_000, Slides = 500, CandidateStatistic = 14 });

        var previous = CultureInfo.CurrentCulture;
        string svg;
        try
        {
            CultureInfo.CurrentCulture = new CultureInfo("de-DE"); // decimal comma must not leak into the numbers
            svg = BackgroundPlotSvg.Render(result);
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
        }

        var doc = XDocument.Parse(svg);
        Assert.Equal("svg", doc.Root!.Name.LocalName);
        var texts = doc.Descendants().Where(e => e.Name.LocalName == "text").Select(e => e.Value).ToList();
        Assert.Contains(texts, t => t.StartsWith("Ranking statistic", StringComparison.Ordinal));
        Assert.Contains(texts, t => t.Contains("(1/s)", StringComparison.Ordinal));
        Assert.Contains(texts, t => t.StartsWith("3σ", StringComparison.Ordinal));
        Assert.Contains(texts, t => t.StartsWith("5σ", StringComparison.Ordinal));
        Assert.Contains(texts, t => t.StartsWith("candidate", StringComparison.Ordinal));
        Assert.Contains(texts, t => t.StartsWith("Cumulative background of KX-MV", StringComparison.Ordinal));
        Assert.DoesNotContain("href", svg, StringComparison.Ordinal);
        Assert.Single(doc.Descendants(), e => e.Name.LocalName == "path");
        foreach (var attr in doc.Descendants().Attributes().Where(x => x.Name.LocalName is "x" or "y" or "x1" or "y1" or "cx" or "cy"))
        {
            Assert.True(double.TryParse(attr.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out _), attr.Value);
        }

        // 5 sigma level as a rate over T_obs: -ln(1 - Q(5)) / T_obs, Q(5) = 2.87e-7 (A&S 26.1, from memory)
        var rate5 = -Math.Log(1 - GaussianTail.Q(5)) / result.ObservingTimeSeconds;
        Assert.Contains(texts, t => t.Contains(rate5.ToString("G3", CultureInfo.InvariantCulture), StringComparison.Ordinal));
    }
}
