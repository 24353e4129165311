using System.Globalization;
using EventReview.Core.Signal.Chirps;

namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>Ridge extraction from a time-frequency map and the leading-order chirp-mass fit.</summary>
public static class ChirpTrack
{
    /// <summary>
    /// For every column the peak frequency is taken (refined by a parabola through the log energies of the three nearest bins);
    /// columns whose peak energy reaches the threshold are loud. Points from the first loud column up to the loudest column are
    /// fitted: y = f^{−8/3} = a + b t by weighted least squares with σ_y = (8/3) f^{−11/3} σ_f, σ_f = resolution / √12.
    /// Then Mc = (−5 b / (8π)^{8/3})^{3/5} / T_sun, σ_Mc = (3/5) Mc σ_b / |b| (σ_b scaled by sqrt(reduced χ²) when above 1),
    /// tc = −a / b. Chirp-like means b &lt; 0 at 3 σ and weighted R² ≥ the minimum.
    /// </summary>
    // Leading-order frequency evolution: Peters and Mathews (1963); the f^(-8/3)-linear-in-time fit is standard practice.
    public static ChirpFit Fit(TimeFrequencyMap map, ChirpTrackOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(map);
        options ??= new ChirpTrackOptions();
        var ts = new List<double>();
        var fsList = new List<double>();
        var energies = new List<double>();
        double df = map.FrequenciesHz.Length > 1 ? map.FrequenciesHz[1] - map.FrequenciesHz[0] : map.ResolutionHz;
        for (int i = 0; i < map.TimesSeconds.Length; i++)
        {
            var row = map.Energy[i];
            int k = 0;
            for (int j = 1; j < row.Length; j++)
            {
                if (row[j] > row[k])
                {
                    k = j;
                }
            }

            if (row[k] < options.EnergyThreshold)
            {
                continue;
            }

            double f = map.FrequenciesHz[k];
            if (k > 0 && k < row.Length - 1 && row[k - 1] > 0 && row[k + 1] > 0)
            {
                double y0 = Math.Log(row[k - 1]), y1 = Math.Log(row[k]), y2 = Math.Log(row[k + 1]);
                double den = y0 - (2 * y1) + y2;
                if (den < 0)
                {
                    f += df * Math.Clamp(0.5 * (y0 - y2) / den, -0.5, 0.5);
                }
            }

            ts.Add(map.TimesSeconds[i]);
            fsList.Add(f);
            energies.Add(row[k]);
        }

        var assumptions = new List<string>
        {
            "leading-order (Newtonian) chirp: f^(-8/3) linear in time; no higher-order, spin or merger corrections",
            string.Create(CultureInfo.InvariantCulture, $"ridge = peak of each STFT column with energy >= {options.EnergyThreshold:G} (noise mean 1); resolution {map.ResolutionHz:G4} Hz"),
            "points from the first loud column to the loudest one; weighted least squares, sigma_f = resolution / sqrt(12)",
            "T_sun = G M_sun / c^3 = 4.925490947641e-6 s",
        };
        if (ts.Count == 0)
        {
            return NoFit("no column of the map is louder than the threshold", ts, fsList, assumptions);
        }

        int loudest = energies.IndexOf(energies.Max());
        int count = loudest + 1;
        var t = ts.Take(count).ToArray();
        var f0 = fsList.Take(count).ToArray();
        if (count < options.MinimumPoints)
        {
            return NoFit($"only {count} loud ridge points before the loudest one; at least {options.MinimumPoints} are needed", t, f0, assumptions);
        }

        double sigmaF = map.ResolutionHz / Math.Sqrt(12);
        var y = f0.Select(f => Math.Pow(f, -8.0 / 3)).ToArray();
        var wts = f0.Select(f => 1 / Math.Pow(8.0 / 3 * Math.Pow(f, -11.0 / 3) * sigmaF, 2)).ToArray();
        double sw = wts.Sum(), st = 0, sy = 0;
        for (int i = 0; i < count; i++)
        {
            st += wts[i] * t[i];
            sy += wts[i] * y[i];
        }

        double tm = st / sw, ym = sy / sw, stt = 0, sty = 0, syy = 0;
        for (int i = 0; i < count; i++)
        {
            stt += wts[i] * (t[i] - tm) * (t[i] - tm);
            sty += wts[i] * (t[i] - tm) * (y[i] - ym);
            syy += wts[i] * (y[i] - ym) * (y[i] - ym);
        }

        double b = sty / stt, a = ym - (b * tm);
        double chi2 = 0;
        for (int i = 0; i < count; i++)
        {
            double r = y[i] - (a + (b * t[i]));
            chi2 += wts[i] * r * r;
        }

        double r2 = syy > 0 ? 1 - (chi2 / syy) : double.NaN;
        double redChi2 = count > 2 ? chi2 / (count - 2) : double.NaN;
        double sigmaB = Math.Sqrt(1 / stt) * Math.Sqrt(Math.Max(1, double.IsNaN(redChi2) ? 1 : redChi2));
        double mc = Chirp.ChirpMassFromSlope(b);
        double sigmaMc = double.IsNaN(mc) ? double.NaN : 0.6 * mc * sigmaB / Math.Abs(b);
        double tc = b != 0 ? -a / b : double.NaN;
        string reason;
        bool ok = false;
        if (!(b < 0))
        {
            reason = "the ridge frequency does not increase with time";
        }
        else if (-b < 3 * sigmaB)
        {
            reason = string.Create(CultureInfo.InvariantCulture, $"the frequency increase is not significant (slope {b:G3} +- {sigmaB:G3})");
        }
        else if (!(r2 >= options.MinimumRSquared))
        {
            reason = string.Create(CultureInfo.InvariantCulture, $"the track does not follow the leading-order chirp law (weighted R^2 = {r2:F2} < {options.MinimumRSquared:F2})");
        }
        else
        {
            ok = true;
            reason = string.Create(CultureInfo.InvariantCulture, $"frequency rises as the leading-order chirp law predicts over {count} points (weighted R^2 = {r2:F2})");
        }

        return new ChirpFit(Finite(mc), Finite(sigmaMc), Finite(tc), Finite(r2), ok, reason, t, f0, assumptions);
    }

    private static double? Finite(double v) => double.IsFinite(v) ? v : null;

    private static ChirpFit NoFit(string reason, List<double> t, List<double> f, List<string> assumptions) =>
        new(null, null, null, null, false, reason, t.ToArray(), f.ToArray(), assumptions);

    private static ChirpFit NoFit(string reason, double[] t, double[] f, List<string> assumptions) =>
        new(null, null, null, null, false, reason, t, f, assumptions);
}
