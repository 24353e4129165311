using System.Globalization;
using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Plots.Figures;

/// <summary>
/// The amplitude spectral density of each site's strain (√PSD of the Welch estimate that whitens the data, in strain/√Hz),
/// log-log, from the first non-zero bin (or 10 Hz, whichever is higher) to the Nyquist frequency, with the analysed
/// band shaded. Each site's fine spectrum is reduced to log-spaced columns keeping their minimum and maximum, so narrow
/// lines stay visible.
/// </summary>
public static class AsdFigure
{
    /// <summary>The figure of the sites' PSDs (code, PSD) with the analysed band [<paramref name="lowHz"/>, <paramref name="highHz"/>] in Hz.</summary>
    /// <exception cref="ArgumentException">When no site is given or the band is not 0 &lt; low &lt; high.</exception>
    public static PlotFigure Build(IReadOnlyList<(string Site, Psd Psd)> sites, double lowHz, double highHz)
    {
        ArgumentNullException.ThrowIfNull(sites);
        if (sites.Count == 0 || !(lowHz > 0) || !(highHz > lowHz))
        {
            throw new ArgumentException("At least one site and a band 0 < low < high (Hz) are needed for the spectrum figure.", nameof(sites));
        }

        var ci = CultureInfo.InvariantCulture;
        double fLo = Math.Max(10, sites.Min(s => s.Psd.FrequencyStepHz)), fHi = sites.Max(s => s.Psd.SampleRateHz / 2);
        fLo = Math.Min(fLo, lowHz / 1.5);
        var lines = new List<PlotElement>();
        var all = new List<double>();
        for (int i = 0; i < sites.Count; i++)
        {
            var (site, psd) = sites[i];
            var (f, v) = SpectrumColumns.Reduce(psd.FrequencyStepHz, psd.Asd(), fLo, fHi);
            all.AddRange(v);
            lines.Add(new PlotLine(f, v)
            {
                Colour = PlotPalette.Series[i % PlotPalette.Series.Count], Width = 1.2, Dashed = i % 2 == 1,
                Label = string.Create(ci, $"{site} ({psd.Segments} Welch segments of {1 / psd.FrequencyStepHz:0.##} s)"),
            });
        }

        all.Sort();
        double yLo = all.Count == 0 ? 1e-24 : Math.Pow(10, Math.Floor(Math.Log10(all[0]))), yHi = all.Count == 0 ? 1e-20 : Math.Pow(10, Math.Ceiling(Math.Log10(all[^1])));
        var elements = new List<PlotElement>
        {
            PlotBand.Rectangle(lowHz, highHz, yLo, yHi) with { Colour = PlotPalette.Shade, Label = string.Create(ci, $"analysed band {lowHz:0.#}–{highHz:0.#} Hz") },
        };
        elements.AddRange(lines);
        string names = string.Join(" and ", sites.Select(s => s.Site));
        string caption = string.Create(ci,
            $"Amplitude spectral density of {names} with the analysed band {lowHz:0.#}–{highHz:0.#} Hz shaded; look for lines or a raised noise floor inside the band");
        return new PlotFigure(caption, new PlotAxis("frequency (Hz)", fLo, fHi, AxisScale.Log),
            new PlotAxis("strain amplitude spectral density (1/√Hz)", yLo, yHi, AxisScale.Log), elements) { LegendRight = true };
    }
}
