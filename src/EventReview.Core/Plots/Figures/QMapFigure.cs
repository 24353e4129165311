using System.Globalization;
using EventReview.Core.Signal.TimeFrequency;

namespace EventReview.Core.Plots.Figures;

/// <summary>
/// The time-frequency map of one site (the constant-Q transform of <see cref="QMap"/>) as a plot-model figure: time in ms
/// from the candidate across, frequency on a log axis up, each tile shaded by power / median on a colour bar capped at
/// the map's 99.5th percentile (tiles under an eighth of the cap left blank so the track stands out), the chirp track's
/// ridge as dots.
/// </summary>
public static class QMapFigure
{
    /// <summary>The figure of <paramref name="map"/> with the ridge of <paramref name="fit"/> (when given), naming <paramref name="site"/>.</summary>
    public static PlotFigure Build(QMap map, ChirpFit? fit, string site, string title = "time-frequency map")
    {
        ArgumentNullException.ThrowIfNull(map);
        var ci = CultureInfo.InvariantCulture;
        var t = map.TimesSeconds.Select(v => v * 1e3).ToArray();
        var f = map.FrequenciesHz;
        var xe = PlotElementLayout.Edges(t, false);
        var ye = PlotElementLayout.Edges(f, true);
        double cap = Math.Max(map.Percentile(0.995), 2);
        var elements = new List<PlotElement>
        {
            new PlotHeatMap(t, f, map.Energy.Select(row => (IReadOnlyList<double>)row).ToArray()),
        };
        if (fit is not null)
        {
            elements.Add(new PlotPoints(fit.TrackTimesSeconds.Select(v => v * 1e3).ToArray(), fit.TrackFrequenciesHz) { Colour = PlotPalette.Warm, Radius = 2.4, Label = "ridge of the track" });
        }

        string caption = fit is null
            ? $"{site} {title}: power / median of the best tile over Q {map.QPlanes[0]:0.#}–{map.QPlanes[^1]:0.#}; look for a rising track"
            : fit.ChirpLike
                ? string.Create(ci, $"{site} {title}: chirp mass {fit.ChirpMassMsun:F1} ± {fit.ChirpMassSigmaMsun:F1} solar masses (leading order); the dots should follow the track")
                : $"{site} {title}: ridge (dots) not chirp-like: {fit.Reason}";
        return new PlotFigure(caption.Trim(), new PlotAxis("time from candidate (ms)", xe[0], xe[^1]), new PlotAxis("frequency (Hz)", ye[0], ye[^1], AxisScale.Log), elements)
        {
            ColourBar = new ColourScale("power / median (dimensionless)", cap / 8, cap, "capped at the 99.5th percentile"),
            LegendRight = true,
        };
    }
}
