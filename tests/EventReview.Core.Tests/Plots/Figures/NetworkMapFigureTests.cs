using EventReview.Core.Network;
using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;

namespace EventReview.Core.Tests.Plots.Figures;

public class NetworkMapFigureTests
{
    private static readonly Site[] Sites =
    [
        new("KX", "Site KX", 47, -105, 100, 36, 126, 1e-4),
        new("MV", "Site MV", 12, -60, 0, 200, 290, 1e-4),
        new("TQ", "Site TQ", -30, 140, 50, 75, 165, 2e-4),
    ];

    [Fact]
    public void The_coastline_covers_about_29_percent_of_the_sphere()
    {
        // Land is about 29 % of the Earth's surface (from memory; Natural Earth's 1:110m outline, lakes as holes, gives 28.9 %).
        // Area of a ring on the unit sphere: |Σ Δλ (2 + sin φ₁ + sin φ₂)| / 2 (Chamberlain and Duquette 2007, "Some algorithms
        // for polygons on a sphere", JPL), the smaller of it and 4π − it.
        double land = 0;
        foreach (var ring in Coastline.Rings)
        {
            double a = 0;
            int n = ring.LongitudeDegrees.Count;
            for (int k = 0; k < n; k++)
            {
                int j = (k + 1) % n;
                double dl = double.DegreesToRadians(Math.IEEERemainder(ring.LongitudeDegrees[j] - ring.LongitudeDegrees[k], 360));
                a += dl * (2 + Math.Sin(double.DegreesToRadians(ring.LatitudeDegrees[k])) + Math.Sin(double.DegreesToRadians(ring.LatitudeDegrees[j])));
            }

            a = Math.Abs(a / 2);
            a = Math.Min(a, (4 * Math.PI) - a);
            land += ring.IsHole ? -a : a;
        }

        Assert.InRange(land / (4 * Math.PI), 0.28, 0.30);
        Assert.InRange(Coastline.Rings.Count, 100, 200);
        Assert.All(Coastline.Rings, r => Assert.True(r.LongitudeDegrees.Count >= 3));
    }

    [Fact]
    public void A_malformed_coastline_line_is_refused_with_its_line_number()
    {
        var ex = Assert.Throws<FormatException>(() => Coastline.Parse(new StringReader("# c\no 0,0 1,1 2,2\no 0,0 1,95 2,2\n")));
        Assert.Contains("line 3", ex.Message);
        Assert.Contains("1,95", ex.Message);
        Assert.Throws<FormatException>(() => Coastline.Parse(new StringReader("x 0,0 1,1 2,2\n")));
    }

    [Fact]
    public void Arms_leave_the_site_along_their_azimuth_on_the_sphere()
    {
        // Direct problem on the sphere, checked by hand: from the equator due east by 90° of arc lands on the equator 90° east;
        // due north by 45° lands at 45° N on the same meridian; from 60° N due east by 90° of arc the great circle leaves the
        // parallel (the latitude falls to asin(sin 60° cos 90°) = 0 and the longitude grows by atan2(sin 90° cos 60°, −sin² 60° · 0) = 90°).
        var (lon, lat) = NetworkMapFigure.Along(0, 0, 90, 90);
        Assert.Equal(90, lon, 9);
        Assert.Equal(0, lat, 9);
        (lon, lat) = NetworkMapFigure.Along(0, 10, 0, 45);
        Assert.Equal(10, lon, 9);
        Assert.Equal(45, lat, 9);
        (lon, lat) = NetworkMapFigure.Along(60, 0, 90, 90);
        Assert.Equal(90, lon, 9);
        Assert.Equal(0, lat, 9);
    }

    [Fact]
    public void Baselines_follow_the_great_circle_and_break_at_the_date_line()
    {
        var a = new Site("AA", "a", 0, 0, 0, 0, 90, 1e-4);
        var b = new Site("BB", "b", 0, 90, 0, 0, 90, 1e-4);
        var (lon, lat) = NetworkMapFigure.GreatCircle(a, b, 2);
        Assert.Equal([0, 45, 90], lon.Select(v => Math.Round(v, 9)));
        Assert.All(lat, v => Assert.Equal(0, v, 9));
        var (lon2, _) = NetworkMapFigure.GreatCircle(new Site("CC", "c", 10, 170, 0, 0, 90, 1e-4), new Site("DD", "d", 10, -170, 0, 0, 90, 1e-4), 8);
        Assert.Contains(lon2, double.IsNaN);
    }

    [Fact]
    public void The_map_shows_every_site_its_arms_and_labelled_baselines_on_a_plain_graticule_in_degrees()
    {
        var fig = NetworkMapFigure.Build(Sites);
        var dots = Assert.Single(fig.Elements.OfType<PlotPoints>());
        Assert.Equal(Sites.Select(s => s.LongitudeDegrees).Order(), dots.Xs.Order());
        Assert.Equal(6, fig.Elements.OfType<PlotLine>().Count(l => l.Colour == PlotPalette.Warm));
        var baselineLabels = fig.Elements.OfType<PlotText>().Where(t => t.Text.EndsWith(" ms", StringComparison.Ordinal)).ToList();
        Assert.Equal(3, baselineLabels.Count);
        Assert.Equal((-180.0, 180.0), (fig.X.Min, fig.X.Max));
        Assert.Equal((-90.0, 90.0), (fig.Y.Min, fig.Y.Max));
        Assert.Equal("longitude (degrees east)", fig.X.Label);
        Assert.Equal("latitude (degrees north)", fig.Y.Label);
        Assert.True(fig.EqualAspect);
        var frame = PlotFrame.For(fig);
        Assert.Equal(2, (frame.Right - frame.Left) / (frame.Bottom - frame.Top), 6); // one degree as long across as up
        var ticks = PlotLayout.Lay(fig).Marks.OfType<TextMark>().Select(t => t.Text).ToList();
        Assert.Contains("−120", ticks);
        Assert.Contains("60", ticks);
        FigureBackEndTests.AssertDrawable(fig);
    }
}
