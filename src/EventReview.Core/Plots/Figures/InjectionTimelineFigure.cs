using System.Globalization;
using EventReview.Core.Injections;

namespace EventReview.Core.Plots.Figures;

/// <summary>
/// The injection log around the candidate: one row per site looked up, time in seconds from the candidate (case time)
/// across; each log entry near the candidate a bar over its span (brick red performed, warm scheduled, grey aborted),
/// widened lightly by the lookup margin on both sides; the site's own arrival time as a dot and the case time as a dashed
/// line. The view spans ±max(60 s, 20 × margin), widened (up to a day) to reach the nearest entry when none is closer, so
/// the picture always says how far the nearest injection was.
/// </summary>
public static class InjectionTimelineFigure
{
    /// <summary>Widest half-span shown, seconds (one day).</summary>
    public const double MaxSpanSeconds = 86400;

    /// <summary>The figure of <paramref name="log"/> around <paramref name="caseGps"/> (GPS s) for the sites of <paramref name="report"/>.</summary>
    public static PlotFigure Build(IReadOnlyList<InjectionRecord> log, InjectionOverlapReport report, double caseGps)
    {
        ArgumentNullException.ThrowIfNull(log);
        ArgumentNullException.ThrowIfNull(report);
        var ci = CultureInfo.InvariantCulture;
        var sites = report.SitesChecked.Select(s => s.Site).Distinct(StringComparer.OrdinalIgnoreCase).ToList();
        var relevant = log.Where(r => sites.Contains(r.Site, StringComparer.OrdinalIgnoreCase)).ToList();
        double Distance(InjectionRecord r) => Math.Max(0, Math.Max(r.Start.Seconds - caseGps, caseGps - r.End.Seconds));
        double span = Math.Max(60, 20 * report.MarginSeconds);
        if (relevant.Count > 0 && relevant.Min(Distance) > span)
        {
            span = Math.Min(MaxSpanSeconds, 1.2 * relevant.Min(Distance));
        }

        var shown = relevant.Where(r => Distance(r) <= span).ToList();
        var elements = new List<PlotElement>
        {
            new PlotLine([0, 0], [-0.5, sites.Count - 0.5]) { Colour = PlotPalette.Warm, Width = 1.2, Dashed = true, Label = "candidate (case time)" },
        };
        var labelled = new HashSet<InjectionStatus>();
        for (int k = 0; k < sites.Count; k++)
        {
            double y = sites.Count - 1 - k;
            foreach (var r in shown.Where(r => string.Equals(r.Site, sites[k], StringComparison.OrdinalIgnoreCase)))
            {
                double a = r.Start.Seconds - caseGps, b = Math.Max(r.End.Seconds - caseGps, a + (span * 0.004));
                elements.Add(PlotBand.Rectangle(a - report.MarginSeconds, b + report.MarginSeconds, y - 0.3, y + 0.3) with { Colour = PlotPalette.Shade });
                string colour = r.Status switch { InjectionStatus.Performed => PlotPalette.Alarm, InjectionStatus.Scheduled => PlotPalette.Warm, _ => PlotPalette.Grey };
                elements.Add(PlotBand.Rectangle(a, b, y - 0.2, y + 0.2) with
                {
                    Colour = colour, Opacity = 0.85,
                    Label = labelled.Add(r.Status) ? $"{r.Status.ToString().ToLowerInvariant()} injection" : null,
                });
                elements.Add(new PlotText(a, y + 0.3, r.Kind) { Colour = PlotPalette.Text });
            }
        }

        var arrivals = report.SitesChecked.Where(s => s.FromArrival).ToList();
        if (arrivals.Count > 0)
        {
            elements.Add(new PlotPoints(arrivals.Select(s => s.Gps - caseGps).ToArray(), arrivals.Select(s => (double)(sites.Count - 1 - sites.IndexOf(s.Site))).ToArray())
                { Colour = PlotPalette.Ink, Radius = 5, Label = "site's arrival time" });
        }

        string nearest = relevant.Count == 0 ? "the log has no entry for these sites"
            : string.Create(ci, $"nearest entry {relevant.Min(Distance):0.#} s from the candidate");
        string caption = string.Create(ci,
            $"Injection log within ±{span:0} s of the candidate: {shown.Count} of {relevant.Count} entries for these sites, {report.Hits.Count} overlapping (margin ±{report.MarginSeconds:0.###} s); {nearest}. No coloured bar should touch the dots");
        return new PlotFigure(caption, new PlotAxis("time from candidate (s)", -span, span),
            new PlotAxis("site (one row each)", -0.5, Math.Max(0, sites.Count - 1) + 0.8 + (0.3 * EnvironmentTimelineFigure.LegendRows(elements))) { Categories = sites.AsEnumerable().Reverse().ToList() }, elements)
        { Height = Math.Max(260, (int)(170 + ((sites.Count + 0.5 + (0.3 * EnvironmentTimelineFigure.LegendRows(elements))) * 40))), LegendRight = true };
    }
}
