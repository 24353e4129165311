using System.Globalization;
using EventReview.Core.Antenna;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Time;
using EventReview.Core.Timing;

namespace EventReview.Core.Plots.Figures;

/// <summary>
/// The sky of a timing check on an equal-area Mollweide map (<see cref="EqualAreaProjection.Mollweide"/>): right
/// ascension 0 at the centre increasing to the left (the sky seen from inside), declination up; a 30° graticule; each
/// pair's ring drawn as a band whose width is the ring's spread for ±1σ of the pair's combined timing uncertainty
/// (cos θ = c (Δt ± σ) / baseline); the directions found circled and numbered best first; directions the antenna
/// patterns allow tinted. RA/Dec are mean-of-date at the check's GMST (UT1 taken as UTC). Equal area, so the tinted
/// share of the map is the share of the sky.
/// </summary>
public static class SkyMapFigure
{
    private const int RingSamples = 240;
    private static readonly double Root2 = Math.Sqrt(2);

    /// <summary>The figure for <paramref name="result"/> over <paramref name="sites"/>, with optional antenna-allowed cells.</summary>
    public static PlotFigure Build(IReadOnlyList<Site> sites, TimingCheckResult result, IReadOnlyList<SkyCell>? allowedCells = null)
    {
        ArgumentNullException.ThrowIfNull(sites);
        ArgumentNullException.ThrowIfNull(result);
        var ci = CultureInfo.InvariantCulture;
        var byCode = sites.ToDictionary(s => s.Code, StringComparer.OrdinalIgnoreCase);
        var elements = new List<PlotElement>();
        bool first = true;
        foreach (var cell in allowedCells ?? [])
        {
            double r0 = cell.RaDegrees - (cell.WidthDegrees / 2), r1 = cell.RaDegrees + (cell.WidthDegrees / 2);
            double d0 = cell.DecDegrees - (cell.HeightDegrees / 2), d1 = cell.DecDegrees + (cell.HeightDegrees / 2);
            var corners = new[] { (r0, d0), (r1, d0), (r1, d1), (r0, d1) }.Select(p => Project(p.Item1, p.Item2)).ToArray();
            if (corners.Max(p => p.X) - corners.Min(p => p.X) < Root2)
            {
                elements.Add(new PlotPolygon(corners.Select(p => p.X).ToArray(), corners.Select(p => p.Y).ToArray())
                    { Colour = PlotPalette.Grey, Opacity = 0.2, Label = first ? "allowed by the antenna patterns" : null });
                first = false;
            }
        }

        Graticule(elements);
        int index = 0;
        foreach (var pair in result.Pairs)
        {
            if (pair.RingAngleDegrees is null || !byCode.TryGetValue(pair.A, out var a) || !byCode.TryGetValue(pair.B, out var b))
            {
                continue;
            }

            var colour = PlotPalette.Series[index++ % PlotPalette.Series.Count];
            var axis = SiteGeometry.Position(a) - SiteGeometry.Position(b);
            double spread = pair.LightTravelSeconds > 0 ? pair.CombinedSigmaSeconds / pair.LightTravelSeconds : 0;
            var inner = Ring(axis, pair.RingCosine - spread, result.GmstDegrees);
            var outer = Ring(axis, pair.RingCosine + spread, result.GmstDegrees);
            for (int k = 0; k < RingSamples; k++)
            {
                int n = (k + 1) % RingSamples;
                var quad = new[] { inner[k], inner[n], outer[n], outer[k] };
                if (quad.Max(p => p.X) - quad.Min(p => p.X) < Root2)
                {
                    elements.Add(new PlotPolygon(quad.Select(p => p.X).ToArray(), quad.Select(p => p.Y).ToArray())
                        { Colour = colour, Opacity = 0.3, Label = k == 0 ? string.Create(ci, $"ring {pair.A}–{pair.B}: {pair.RingAngleDegrees:0.0}° about the baseline, width ±1σ") : null });
                }
            }

            var centre = Ring(axis, pair.RingCosine, result.GmstDegrees);
            elements.Add(Line(centre.Append(centre[0]).ToList(), colour, 1.2));
        }

        var found = result.Sky.Select(s => Project(s.RaDegrees, s.DecDegrees)).ToArray();
        if (found.Length > 0)
        {
            elements.Add(new PlotPoints(found.Select(p => p.X).ToArray(), found.Select(p => p.Y).ToArray()) { Colour = PlotPalette.Alarm, Radius = 5, Label = "directions found (numbered best first)" });
            elements.AddRange(found.Select((p, i) => new PlotText(p.X + 0.06, p.Y + 0.06, (i + 1).ToString(ci)) { Colour = PlotPalette.Alarm }));
        }

        string caption = string.Create(ci, $"Sky (RA/Dec of date, GMST {result.GmstDegrees:0.0}°), equal-area: the rings should cross where the directions are found");
        return new PlotFigure(caption, new PlotAxis("right ascension (degrees), increasing to the left", -2 * Root2 * 1.01, 2 * Root2 * 1.01, AxisScale.Hidden),
            new PlotAxis("declination (degrees)", -Root2 * 1.02, Root2 * 1.02, AxisScale.Hidden), elements)
        { EqualAspect = true, Height = 460 };
    }

    /// <summary>Map coordinates of (RA, Dec) in degrees: Mollweide with x mirrored so RA grows to the left.</summary>
    public static (double X, double Y) Project(double raDegrees, double decDegrees)
    {
        double lambda = Math.IEEERemainder(raDegrees, 360);
        var (x, y) = EqualAreaProjection.Mollweide(double.DegreesToRadians(lambda), double.DegreesToRadians(Math.Clamp(decDegrees, -90, 90)));
        return (-x, y);
    }

    private static List<(double X, double Y)> Ring(Vector3 axis, double cosine, double gmst) =>
        SkyRing.Directions(axis, Math.Clamp(cosine, -1, 1), RingSamples).Select(n => SkyFrame.ToEquatorial(n, gmst)).Select(e => Project(e.RaDegrees, e.DecDegrees)).ToList();

    /// <summary>A line through map points, broken where it jumps across the map's edge.</summary>
    private static PlotLine Line(List<(double X, double Y)> points, string colour, double width, bool dashed = false)
    {
        var xs = new List<double>();
        var ys = new List<double>();
        for (int k = 0; k < points.Count; k++)
        {
            if (k > 0 && Math.Abs(points[k].X - points[k - 1].X) > Root2)
            {
                xs.Add(double.NaN);
                ys.Add(double.NaN);
            }

            xs.Add(points[k].X);
            ys.Add(points[k].Y);
        }

        return new PlotLine(xs, ys) { Colour = colour, Width = width, Dashed = dashed };
    }

    private static void Graticule(List<PlotElement> elements)
    {
        var ci = CultureInfo.InvariantCulture;
        for (int ra = -180; ra <= 180; ra += 30)
        {
            var meridian = Enumerable.Range(0, 91).Select(k => Project(ra == 180 ? 179.999 : ra == -180 ? -179.999 : ra, -90 + (2 * k))).ToList();
            elements.Add(Line(meridian, Math.Abs(ra) == 180 ? PlotPalette.Text : PlotPalette.Grey, Math.Abs(ra) == 180 ? 1 : 0.5));
        }

        for (int dec = -60; dec <= 60; dec += 30)
        {
            var parallel = Enumerable.Range(0, 181).Select(k => Project(-179.999 + (k * 359.998 / 180), dec)).ToList();
            elements.Add(Line(parallel, PlotPalette.Grey, 0.5));
            var (x, y) = Project(179.999, dec);
            elements.Add(new PlotText(x + 0.02, y + 0.03, $"{dec:+0;−0}°") { Colour = PlotPalette.Text });
        }

        foreach (var ra in new[] { 0, 60, 120, 240, 300 })
        {
            var (x, y) = Project(ra, 0);
            elements.Add(new PlotText(x + 0.02, y - 0.1, ra.ToString(ci) + "°") { Colour = PlotPalette.Text });
        }
    }
}
