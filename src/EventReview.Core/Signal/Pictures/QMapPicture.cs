using System.Globalization;
using System.Net;
using System.Text;
using EventReview.Core.Pictures;
using EventReview.Core.Signal.TimeFrequency;

namespace EventReview.Core.Signal.Pictures;

/// <summary>
/// SVG of a Q map: time (ms from the candidate) across, frequency on a logarithmic axis up, each cell shaded from paper to ink by its
/// power / median, the scale capped at the map's 99.5th percentile and shown as a colour bar; the chirp track's ridge points as
/// dots. The map is drawn in at most 120 × 60 blocks (each the largest value it covers); blocks below an eighth of the cap are left
/// blank and runs of equal shade are merged into one path per shade, so the document stays under 200 kB.
/// Text is 12 px or larger.
/// </summary>
public static class QMapPicture
{
    private const int Width = 760, Height = 420, Left = 72, Right = 120, Top = 24, Bottom = 84, Shades = 24, MaxColumns = 120, MaxRows = 60;

    /// <summary>Draws <paramref name="map"/> with the ridge of <paramref name="fit"/> (when given) and a caption naming <paramref name="site"/>.</summary>
    public static string Draw(QMap map, ChirpFit? fit, string site, string title = "Q map")
    {
        ArgumentNullException.ThrowIfNull(map);
        var ci = CultureInfo.InvariantCulture;
        var t = map.TimesSeconds;
        var f = map.FrequenciesHz;
        double dt = t.Length > 1 ? t[1] - t[0] : 0.01;
        double t0 = (t[0] - (dt / 2)) * 1e3, t1 = (t[^1] + (dt / 2)) * 1e3;
        double ratio = f.Length > 1 ? Math.Sqrt(f[1] / f[0]) : 1.05;
        double fLo = f[0] / ratio, fHi = f[^1] * ratio;
        double cap = Math.Max(map.Percentile(0.995), 2);
        double plotW = Width - Left - Right, plotH = Height - Top - Bottom;
        double X(double ms) => Left + ((ms - t0) / (t1 - t0) * plotW);
        double Y(double hz) => Top + plotH - (Math.Log(hz / fLo) / Math.Log(fHi / fLo) * plotH);
        var sb = new StringBuilder();
        sb.Append(ci, $"<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"{Width}\" height=\"{Height}\" viewBox=\"0 0 {Width} {Height}\" font-family=\"sans-serif\" font-size=\"12\">");
        sb.Append(ci, $"<rect width=\"100%\" height=\"100%\" fill=\"{PicturePalette.Surface}\"/><rect x=\"{Left}\" y=\"{Top}\" width=\"{plotW}\" height=\"{plotH}\" fill=\"{PicturePalette.Paper}\"/>");
        // Coarse blocks (at most MaxColumns × MaxRows, each the largest value it covers), one path per shade, runs merged.
        int cols = Math.Min(MaxColumns, t.Length), rows = Math.Min(MaxRows, f.Length);
        var paths = new StringBuilder[Shades + 1];
        for (int r = 0; r < rows; r++)
        {
            int j0 = r * f.Length / rows, j1 = Math.Max(j0 + 1, (r + 1) * f.Length / rows);
            int ya = (int)Math.Floor(Y(f[j1 - 1] * ratio)), yb = (int)Math.Ceiling(Y(f[j0] / ratio));
            int c = 0;
            while (c < cols)
            {
                int shade = Shade(BlockMax(map, c, cols, j0, j1), cap);
                int end = c + 1;
                while (end < cols && Shade(BlockMax(map, end, cols, j0, j1), cap) == shade)
                {
                    end++;
                }

                if (shade > 0)
                {
                    int i0 = c * t.Length / cols, i1 = Math.Max(i0 + 1, end * t.Length / cols);
                    int xa = (int)Math.Floor(X((t[i0] - (dt / 2)) * 1e3)), xb = (int)Math.Ceiling(X((t[i1 - 1] + (dt / 2)) * 1e3));
                    (paths[shade] ??= new StringBuilder()).Append(ci, $"M{xa} {ya}h{xb - xa}v{yb - ya}h{xa - xb}z");
                }

                c = end;
            }
        }

        for (int shade = 1; shade <= Shades; shade++)
        {
            if (paths[shade] is { } d)
            {
                sb.Append(ci, $"<path fill=\"{Colour(shade)}\" d=\"{d}\"/>");
            }
        }

        if (fit is not null)
        {
            for (int k = 0; k < fit.TrackTimesSeconds.Length; k++)
            {
                double ms = fit.TrackTimesSeconds[k] * 1e3, hz = fit.TrackFrequenciesHz[k];
                if (ms < t0 || ms > t1 || hz < fLo || hz > fHi)
                {
                    continue; // a zoomed map shows only the part of the track inside it
                }

                sb.Append(ci, $"<circle cx=\"{X(fit.TrackTimesSeconds[k] * 1e3):0.#}\" cy=\"{Y(fit.TrackFrequenciesHz[k]):0.#}\" r=\"2.2\" fill=\"{PicturePalette.Warm}\"/>");
            }
        }

        Axes(sb, t0, t1, fLo, fHi, X, Y);
        ColourBar(sb, cap);
        string caption = fit is null
            ? $"{site} {title}: power / median of the best-matching tile over Q {map.QPlanes[0]:0.#}–{map.QPlanes[^1]:0.#}"
            : fit.ChirpLike
                ? string.Create(ci, $"{site} {title} with chirp track (dots): chirp mass {fit.ChirpMassMsun:F1} ± {fit.ChirpMassSigmaMsun:F1} solar masses (leading order)")
                : $"{site} {title} with ridge (dots): not chirp-like, {fit.Reason}";
        Text(sb, Width / 2.0, Height - 12, caption.Trim(), "middle", "font-style=\"italic\"");
        sb.Append("</svg>");
        return sb.ToString();
    }

    private static double BlockMax(QMap map, int column, int columns, int j0, int j1)
    {
        int i0 = column * map.TimesSeconds.Length / columns, i1 = Math.Max(i0 + 1, (column + 1) * map.TimesSeconds.Length / columns);
        double best = 0;
        for (int i = i0; i < i1; i++)
        {
            for (int j = j0; j < j1; j++)
            {
                best = Math.Max(best, map.Energy[i][j]);
            }
        }

        return best;
    }

    private static int Shade(double value, double cap)
    {
        double level = Math.Clamp(value / cap, 0, 1);
        return level < 0.125 ? 0 : Math.Max(1, (int)Math.Round(level * Shades));
    }

    /// <summary>Paper (level 0) to ink blue (level 1), linearly in RGB.</summary>
    private static string Colour(int shade) => PicturePalette.Mix(PicturePalette.Paper, PicturePalette.Ink, shade / (double)Shades);

    private static void Axes(StringBuilder sb, double t0, double t1, double fLo, double fHi, Func<double, double> x, Func<double, double> y)
    {
        var ci = CultureInfo.InvariantCulture;
        double plotW = Width - Left - Right, plotH = Height - Top - Bottom;
        sb.Append(ci, $"<rect x=\"{Left}\" y=\"{Top}\" width=\"{plotW}\" height=\"{plotH}\" fill=\"none\" stroke=\"{PicturePalette.Text}\"/>");
        double raw = (t1 - t0) / 6, mag = Math.Pow(10, Math.Floor(Math.Log10(raw)));
        double step = new[] { 1, 2, 5, 10 }.Select(m => m * mag).First(v => v >= raw);
        for (double v = Math.Ceiling(t0 / step) * step; v <= t1 + 1e-9; v += step)
        {
            sb.Append(ci, $"<line x1=\"{x(v):0.#}\" y1=\"{Top + plotH}\" x2=\"{x(v):0.#}\" y2=\"{Top + plotH + 5}\" stroke=\"{PicturePalette.Text}\"/>");
            Text(sb, x(v), Top + plotH + 18, Math.Abs(v) < 1e-9 ? "0" : v.ToString("G4", ci), "middle");
        }

        foreach (var hz in new[] { 10.0, 20, 30, 50, 100, 200, 300, 500, 1000, 2000 }.Where(h => h >= fLo && h <= fHi))
        {
            sb.Append(ci, $"<line x1=\"{Left - 5}\" y1=\"{y(hz):0.#}\" x2=\"{Left}\" y2=\"{y(hz):0.#}\" stroke=\"{PicturePalette.Text}\"/>");
            Text(sb, Left - 8, y(hz) + 4, hz.ToString("G4", ci), "end");
        }

        Text(sb, Left + (plotW / 2), Top + plotH + 38, "time from candidate (ms)", "middle");
        Text(sb, 18, Top + (plotH / 2), "frequency (Hz, log scale)", "middle", string.Create(ci, $"transform=\"rotate(-90 18 {Top + (plotH / 2):0.#})\""));
    }

    private static void ColourBar(StringBuilder sb, double cap)
    {
        var ci = CultureInfo.InvariantCulture;
        double x = Width - Right + 24, plotH = Height - Top - Bottom;
        for (int s = 1; s <= Shades; s++)
        {
            double ya = Top + plotH - (s / (double)Shades * plotH), h = plotH / Shades;
            sb.Append(ci, $"<rect x=\"{x:0.#}\" y=\"{ya:0.#}\" width=\"16\" height=\"{h + 0.5:0.#}\" fill=\"{Colour(s)}\"/>");
        }

        sb.Append(ci, $"<rect x=\"{x:0.#}\" y=\"{Top}\" width=\"16\" height=\"{plotH}\" fill=\"none\" stroke=\"{PicturePalette.Text}\"/>");
        foreach (var v in new[] { 0.125, 0.5, 1.0 })
        {
            double ya = Top + plotH - (v * plotH);
            Text(sb, x + 20, ya + 4, (v * cap).ToString(cap * v >= 10 ? "0" : "0.#", ci), "start");
        }

        Text(sb, x + 8, Top + plotH + 18, "power / median", "middle");
        Text(sb, x + 8, Top + plotH + 34, "(capped at 99.5 %)", "middle");
    }

    private static void Text(StringBuilder sb, double x, double y, string text, string anchor, string extra = "") =>
        sb.Append(CultureInfo.InvariantCulture, $"<text x=\"{x:0.#}\" y=\"{y:0.#}\" text-anchor=\"{anchor}\" {extra}>{WebUtility.HtmlEncode(text)}</text>");
}
