using System.Globalization;
using EventReview.Core.Plots;

namespace EventReview.Core.Tests.Plots.Figures;

/// <summary>
/// Checks every new figure must pass: the SVG holds exactly the marks the layout made (the PDF back end draws what it
/// reads back from the SVG, so both back ends draw the same elements), the bytes do not depend on the culture, text is
/// at least 12 px, and each drawn axis carries a unit in parentheses.
/// </summary>
internal static class FigureBackEndTests
{
    public static void AssertDrawable(PlotFigure figure)
    {
        var laid = PlotLayout.Lay(figure);
        var svg = PlotSvg.Write(figure);
        var previous = CultureInfo.CurrentCulture;
        try
        {
            CultureInfo.CurrentCulture = new CultureInfo("de-DE"); // a decimal comma must not change a byte
            Assert.Equal(svg, PlotSvg.Write(figure));
        }
        finally
        {
            CultureInfo.CurrentCulture = previous;
        }

        var read = PlotSvg.Read(svg);
        Assert.NotNull(read);
        Assert.Equal(laid.Marks.Count, read.Marks.Count);
        Assert.Equal(laid.Marks.Select(m => m.GetType().Name), read.Marks.Select(m => m.GetType().Name));
        Assert.Equal(laid.Marks.OfType<TextMark>().Select(t => t.Text), read.Marks.OfType<TextMark>().Select(t => t.Text));
        Assert.Equal(figure.Caption, read.Caption);
        Assert.All(laid.Marks.OfType<TextMark>(), t => Assert.True(t.Size >= PlotPalette.MinimumTextPx, t.Text));
        foreach (var axis in new[] { figure.X, figure.Y }.Where(a => a.Scale != AxisScale.Hidden))
        {
            Assert.Matches(@"\(.+\)", axis.Label);
            Assert.Contains(laid.Marks.OfType<TextMark>(), t => t.Text == axis.Label);
        }

        Assert.False(string.IsNullOrWhiteSpace(figure.Caption));
        Assert.DoesNotContain('\n', figure.Caption);
    }
}
