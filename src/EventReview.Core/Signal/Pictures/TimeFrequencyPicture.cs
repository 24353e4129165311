using System.Globalization;
using System.Text;
using EventReview.Core.Signal.TimeFrequency;

namespace EventReview.Core.Signal.Pictures;

/// <summary>SVG of a time-frequency map with the fitted chirp track.</summary>
public static class TimeFrequencyPicture
{
    /// <summary>
    /// Draws the map on a coarse grid (at most <paramref name="maxColumns"/> × <paramref name="maxRows"/> cells, each the maximum
    /// of the energies it covers) with a white-to-dark colour scale clipped at <paramref name="energyCap"/>, and the ridge points of
    /// <paramref name="fit"/> as dots. Cells below a fifth of the cap are left white, and cells are written with whole-pixel
    /// coordinates, so the document stays under ~200 kB even when every cell is drawn. Times in ms from the map's reference.
    /// </summary>
    public static string Draw(TimeFrequencyMap map, ChirpFit? fit, string site = "", int maxColumns = 80, int maxRows = 40, double energyCap = 25)
    {
        ArgumentNullException.ThrowIfNull(map);
        var t = map.TimesSeconds;
        var f = map.FrequenciesHz;
        double dt = t.Length > 1 ? t[1] - t[0] : 0.01;
        double fLo = f[0], fHi = f[^1];
        var p = new SvgPlot((t[0] - (dt / 2)) * 1e3, (t[^1] + (dt / 2)) * 1e3, fLo, fHi);
        int cols = Math.Min(maxColumns, t.Length), rows = Math.Min(maxRows, f.Length);
        var sb = new StringBuilder();
        for (int c = 0; c < cols; c++)
        {
            int i0 = c * t.Length / cols, i1 = Math.Max(i0 + 1, (c + 1) * t.Length / cols);
            for (int r = 0; r < rows; r++)
            {
                int j0 = r * f.Length / rows, j1 = Math.Max(j0 + 1, (r + 1) * f.Length / rows);
                double e = 0;
                for (int i = i0; i < i1; i++)
                {
                    for (int j = j0; j < j1; j++)
                    {
                        e = Math.Max(e, map.Energy[i][j]);
                    }
                }

                double level = Math.Clamp(e / energyCap, 0, 1);
                if (level < 0.2)
                {
                    continue;
                }

                int shade = (int)Math.Round(255 * (1 - level));
                string colour = string.Create(CultureInfo.InvariantCulture, $"#{shade:x2}{(int)(shade * 0.85):x2}{Math.Min(255, shade + 60):x2}");
                double x0 = p.X((t[i0] - (dt / 2)) * 1e3), x1 = p.X((t[i1 - 1] + (dt / 2)) * 1e3);
                double y0 = p.Y(f[j0]), y1 = p.Y(j1 < f.Length ? f[j1] : fHi);
                int xa = (int)Math.Floor(x0), xb = (int)Math.Ceiling(x1), ya = (int)Math.Floor(y1), yb = (int)Math.Ceiling(y0);
                sb.Append(CultureInfo.InvariantCulture, $"<rect x=\"{xa}\" y=\"{ya}\" width=\"{xb - xa}\" height=\"{yb - ya}\" fill=\"{colour}\"/>");
            }
        }

        p.Raw(sb.ToString());
        if (fit is not null)
        {
            for (int i = 0; i < fit.TrackTimesSeconds.Length; i++)
            {
                p.Raw(string.Create(CultureInfo.InvariantCulture,
                    $"<circle cx=\"{SvgPlot.F(p.X(fit.TrackTimesSeconds[i] * 1e3))}\" cy=\"{SvgPlot.F(p.Y(fit.TrackFrequenciesHz[i]))}\" r=\"2\" fill=\"#d0562a\"/>"));
            }
        }

        p.Axes("time from candidate (ms)", "frequency (Hz)");
        string caption = fit is null
            ? $"{site} time-frequency map (normalised energy, noise mean 1, scale capped at {energyCap:G})"
            : fit.ChirpLike
                ? string.Create(CultureInfo.InvariantCulture, $"{site} map with chirp track (dots): chirp mass {fit.ChirpMassMsun:F1} +- {fit.ChirpMassSigmaMsun:F1} solar masses")
                : $"{site} map with ridge (dots): not chirp-like, {fit.Reason}";
        return p.Finish(caption.Trim());
    }
}
