using System.Globalization;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;

namespace EventReview.Core.Plots.Figures;

/// <summary>
/// The network on a plain (equirectangular) map of the Earth: longitude east across, geodetic latitude north up, one
/// degree the same length both ways, a labelled 30° graticule; the continents' outline (<see cref="Coastline"/>); each
/// site as a dot with its code; its x arm (solid) and y arm (dashed) drawn 12° of arc long along their azimuths
/// (clockwise from true north); each baseline as the great circle between the sites, labelled with its light-travel time
/// (chord length / c).
/// </summary>
public static class NetworkMapFigure
{
    /// <summary>Drawn arm length, degrees of arc (a symbol, not to scale).</summary>
    public const double ArmDegrees = 12;

    /// <summary>The map of <paramref name="sites"/>.</summary>
    public static PlotFigure Build(IReadOnlyList<Site> sites)
    {
        ArgumentNullException.ThrowIfNull(sites);
        var ci = CultureInfo.InvariantCulture;
        var elements = new List<PlotElement>();
        bool first = true;
        foreach (var ring in Coastline.Rings)
        {
            elements.Add(new PlotPolygon(ring.LongitudeDegrees, ring.LatitudeDegrees)
            {
                Colour = ring.IsHole ? PlotPalette.Surface : PlotPalette.Land,
                Label = first && !ring.IsHole ? "land (Natural Earth, 1:110m)" : null,
            });
            first &= ring.IsHole;
        }

        for (int lon = -150; lon <= 150; lon += 30)
        {
            elements.Add(new PlotLine([lon, lon], [-90, 90]) { Colour = PlotPalette.Rule, Width = 0.6 });
        }

        for (int lat = -60; lat <= 60; lat += 30)
        {
            elements.Add(new PlotLine([-180, 180], [lat, lat]) { Colour = PlotPalette.Rule, Width = 0.6 });
        }

        var ordered = sites.OrderBy(s => s.Code, StringComparer.Ordinal).ToList();
        bool firstBaseline = true;
        for (int i = 0; i < ordered.Count; i++)
        {
            for (int j = i + 1; j < ordered.Count; j++)
            {
                var (xs, ys) = GreatCircle(ordered[i], ordered[j], 64);
                var ms = Baseline.Between(ordered[i], ordered[j]).LightTravelSeconds * 1e3;
                elements.Add(new PlotLine(xs, ys) { Colour = PlotPalette.Steel, Width = 1.2, Dashed = true, Label = firstBaseline ? "baseline (great circle), light-travel time" : null });
                firstBaseline = false;
                int mid = xs.Length / 2;
                if (!double.IsNaN(xs[mid]))
                {
                    elements.Add(new PlotText(xs[mid] + 2, ys[mid] - 6, string.Create(ci, $"{ms:0.00} ms")) { Colour = PlotPalette.Steel });
                }
            }
        }

        bool firstArm = true;
        foreach (var s in ordered)
        {
            var (xe, ye) = Along(s.LatitudeDegrees, s.LongitudeDegrees, s.XArmAzimuthDegrees, ArmDegrees);
            var (ye2, yy2) = Along(s.LatitudeDegrees, s.LongitudeDegrees, s.YArmAzimuthDegrees, ArmDegrees);
            elements.Add(new PlotLine([s.LongitudeDegrees, xe], [s.LatitudeDegrees, ye]) { Colour = PlotPalette.Warm, Width = 2.5, Label = firstArm ? "x arm (azimuth from north)" : null });
            elements.Add(new PlotLine([s.LongitudeDegrees, ye2], [s.LatitudeDegrees, yy2]) { Colour = PlotPalette.Warm, Width = 2.5, Dashed = true, Label = firstArm ? "y arm" : null });
            firstArm = false;
        }

        elements.Add(new PlotPoints(ordered.Select(s => s.LongitudeDegrees).ToArray(), ordered.Select(s => s.LatitudeDegrees).ToArray())
            { Colour = PlotPalette.Ink, Radius = 5, Label = "site" });
        elements.AddRange(ordered.Select(s => new PlotText(s.LongitudeDegrees + 3, s.LatitudeDegrees + 3, s.Code) { Colour = PlotPalette.Ink }));
        string caption = ordered.Count < 2
            ? "Sites of the network with their arms; add a second site to see a baseline"
            : string.Create(ci, $"{ordered.Count} sites, {ordered.Count * (ordered.Count - 1) / 2} baselines with their light-travel times; arms along their azimuths. Check each site's place and arm directions");
        return new PlotFigure(caption,
            new PlotAxis("longitude (degrees east)", -180, 180) { TickStep = 30 },
            new PlotAxis("latitude (degrees north)", -90, 90) { TickStep = 30 }, elements)
        { EqualAspect = true, Height = 440, LegendBottom = true };
    }

    /// <summary>
    /// The point <paramref name="arcDegrees"/> along the great circle leaving (<paramref name="latDegrees"/>, <paramref name="lonDegrees"/>)
    /// at <paramref name="azimuthDegrees"/> clockwise from north, on a sphere (the direct problem: lat₂ = asin(sin φ cos δ + cos φ sin δ cos α),
    /// Δλ = atan2(sin α sin δ cos φ, cos δ − sin φ sin φ₂); common practice). Returns (longitude, latitude) in degrees.
    /// </summary>
    public static (double Lon, double Lat) Along(double latDegrees, double lonDegrees, double azimuthDegrees, double arcDegrees)
    {
        double phi = double.DegreesToRadians(latDegrees), a = double.DegreesToRadians(azimuthDegrees), d = double.DegreesToRadians(arcDegrees);
        double phi2 = Math.Asin((Math.Sin(phi) * Math.Cos(d)) + (Math.Cos(phi) * Math.Sin(d) * Math.Cos(a)));
        double dl = Math.Atan2(Math.Sin(a) * Math.Sin(d) * Math.Cos(phi), Math.Cos(d) - (Math.Sin(phi) * Math.Sin(phi2)));
        return (Math.IEEERemainder(lonDegrees + double.RadiansToDegrees(dl), 360), double.RadiansToDegrees(phi2));
    }

    /// <summary>Points along the great circle from <paramref name="a"/> to <paramref name="b"/> (spherical, by slerp), broken (NaN) where it crosses ±180°.</summary>
    public static (double[] Lon, double[] Lat) GreatCircle(Site a, Site b, int segments)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        static (double X, double Y, double Z) Unit(Site s)
        {
            double p = double.DegreesToRadians(s.LatitudeDegrees), l = double.DegreesToRadians(s.LongitudeDegrees);
            return (Math.Cos(p) * Math.Cos(l), Math.Cos(p) * Math.Sin(l), Math.Sin(p));
        }

        var u = Unit(a);
        var v = Unit(b);
        double omega = Math.Acos(Math.Clamp((u.X * v.X) + (u.Y * v.Y) + (u.Z * v.Z), -1, 1));
        var lon = new List<double>();
        var lat = new List<double>();
        for (int k = 0; k <= segments; k++)
        {
            double t = k / (double)segments;
            double wa = omega < 1e-12 ? 1 - t : Math.Sin((1 - t) * omega) / Math.Sin(omega), wb = omega < 1e-12 ? t : Math.Sin(t * omega) / Math.Sin(omega);
            double x = (wa * u.X) + (wb * v.X), y = (wa * u.Y) + (wb * v.Y), z = (wa * u.Z) + (wb * v.Z);
            double lo = double.RadiansToDegrees(Math.Atan2(y, x)), la = double.RadiansToDegrees(Math.Atan2(z, Math.Sqrt((x * x) + (y * y))));
            if (lon.Count > 0 && !double.IsNaN(lon[^1]) && Math.Abs(lo - lon[^1]) > 180)
            {
                lon.Add(double.NaN);
                lat.Add(double.NaN);
            }

            lon.Add(lo);
            lat.Add(la);
        }

        return (lon.ToArray(), lat.ToArray());
    }
}
