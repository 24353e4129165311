using System.Globalization;
using EventReview.Core.Signal.Chirps;

namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>Ridge extraction from a Q map and the leading-order chirp-mass fit.</summary>
public static class ChirpTrack
{
    /// <summary>
    /// For every column the peak frequency is taken (refined by a parabola through the log values of the three nearest rows,
    /// interpolated in log frequency); columns whose peak reaches the threshold are loud. The loud columns leading up to the loudest
    /// (without a longer gap than <see cref="ChirpTrackOptions.MaxGapSeconds"/> or three tile durations Q / (2 √11 f), and without
    /// points more than 30 % off the median frequency of their seven neighbours) are fitted: y = f^{−8/3} = a + b t by weighted least squares with σ_y = (8/3) f^{−11/3} σ_f, σ_f = the full width of the
    /// point's tile, 2 f √11 / Q, over √12; neighbouring columns share tiles, so the slope's σ is scaled by sqrt(points / independent points). Then Mc = (−5 b / (8π)^{8/3})^{3/5} / T_sun, σ_Mc = (3/5) Mc σ_b / |b| (σ_b scaled by sqrt(reduced χ²) when
    /// above 1), tc = −a / b. Chirp-like means b &lt; 0 at 3 σ and weighted R² ≥ the minimum. <see cref="ChirpFit.Scope"/> says what
    /// the fit can and cannot tell, with more caution for a chirp mass above the high-mass limit (a short signal in band).
    /// </summary>
    // Leading-order frequency evolution: Peters and Mathews (1963); the f^(-8/3)-linear-in-time fit is standard practice.
    public static ChirpFit Fit(QMap map, ChirpTrackOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(map);
        options ??= new ChirpTrackOptions();
        var ts = new List<double>();
        var fsList = new List<double>();
        var sigmas = new List<double>();
        var energies = new List<double>();
        var durations = new List<double>();
        var f = map.FrequenciesHz;
        for (int i = 0; i < map.TimesSeconds.Length; i++)
        {
            var row = map.Energy[i];
            int k = 0;
            for (int j = 1; j < row.Length; j++)
            {
                k = row[j] > row[k] ? j : k;
            }

            if (row[k] < options.EnergyThreshold)
            {
                continue;
            }

            double freq = f[k];
            if (k > 0 && k < row.Length - 1 && row[k - 1] > 0 && row[k + 1] > 0)
            {
                double y0 = Math.Log(row[k - 1]), y1 = Math.Log(row[k]), y2 = Math.Log(row[k + 1]);
                double den = y0 - (2 * y1) + y2;
                if (den < 0)
                {
                    double d = Math.Clamp(0.5 * (y0 - y2) / den, -0.5, 0.5);
                    freq = f[k] * Math.Pow(d >= 0 ? f[k + 1] / f[k] : f[k] / f[k - 1], d);
                }
            }

            double q = map.BestQ[i][k] > 0 ? map.BestQ[i][k] : map.QPlanes[0];
            ts.Add(map.TimesSeconds[i]);
            fsList.Add(freq);
            sigmas.Add(Bandwidth(freq, q));
            energies.Add(row[k]);
            durations.Add(q / (2 * Math.Sqrt(11) * freq));
        }

        var assumptions = new List<string>
        {
            "leading-order (Newtonian) chirp: f^(-8/3) linear in time; no higher-order, spin or merger corrections",
            string.Create(CultureInfo.InvariantCulture, $"ridge = loudest row of each column of the Q map with power / median >= {options.EnergyThreshold:G}; sigma_f = the tile's full bandwidth 2 f sqrt(11) / Q over sqrt(12); columns within one tile duration Q / (2 sqrt(11) f) share a tile, so the slope's sigma counts independent points only"),
            string.Create(CultureInfo.InvariantCulture, $"track = the loud points leading up to the loudest one without a gap longer than {options.MaxGapSeconds:G} s or three tile durations; weighted least squares, slope uncertainty scaled by sqrt(reduced chi-square) when above 1"),
            "T_sun = G M_sun / c^3 = 4.925490947641e-6 s",
        };
        if (ts.Count == 0)
        {
            return NoFit("no column of the map is louder than the threshold", [], [], assumptions);
        }

        // The track: from the loudest point back through loud points no further apart than a gap limit (isolated loud noise
        // columns earlier in the map do not join it).
        int loudest = energies.IndexOf(energies.Max());
        int first = loudest;
        while (first > 0 && ts[first] - ts[first - 1] <= Math.Max(options.MaxGapSeconds, 3 * durations[first - 1]))
        {
            first--;
        }

        // A column whose loudest cell is noise far from the track (an isolated high-frequency tile) would dominate a fit in
        // f^(-8/3): points more than 30 % away from the median frequency of their seven neighbours are left out.
        var keep = Enumerable.Range(first, loudest - first + 1).Where(i => Math.Abs(Math.Log(fsList[i] / LocalMedian(fsList, i, first, loudest))) <= Math.Log(1.3)).ToList();
        int count = keep.Count;
        var t = keep.Select(i => ts[i]).ToArray();
        var f0 = keep.Select(i => fsList[i]).ToArray();
        var sf = keep.Select(i => sigmas[i]).ToArray();
        var dur = keep.Select(i => durations[i]).ToArray();
        if (count < options.MinimumPoints)
        {
            return NoFit($"only {count} loud ridge points lead up to the loudest one; at least {options.MinimumPoints} are needed", t, f0, assumptions);
        }

        var y = f0.Select(v => Math.Pow(v, -8.0 / 3)).ToArray();
        var wts = f0.Select((v, i) => 1 / Math.Pow(8.0 / 3 * Math.Pow(v, -11.0 / 3) * sf[i], 2)).ToArray();
        // Neighbouring columns see the same tile: the points are worth about Σ (column step / tile duration) independent ones, so
        // the slope's sigma is scaled by sqrt(points / independent points).
        double step = map.TimesSeconds.Length > 1 ? map.TimesSeconds[1] - map.TimesSeconds[0] : 0;
        double independent = Math.Max(2, dur.Sum(d => Math.Min(1, step / d)));
        var line = WeightedLine.Fit(t, y, wts).Inflated(Math.Sqrt(Math.Max(1, count / independent)));
        double mc = Chirp.ChirpMassFromSlope(line.Slope);
        double sigmaMc = double.IsNaN(mc) ? double.NaN : 0.6 * mc * line.SlopeSigma / Math.Abs(line.Slope);
        double tc = line.Slope != 0 ? -line.Intercept / line.Slope : double.NaN;
        string reason;
        bool ok = false;
        if (!(line.Slope < 0))
        {
            reason = "the ridge frequency does not increase with time";
        }
        else if (-line.Slope < 3 * line.SlopeSigma)
        {
            reason = string.Create(CultureInfo.InvariantCulture, $"the frequency increase is not significant (slope {line.Slope:G3} +- {line.SlopeSigma:G3})");
        }
        else if (!(line.RSquared >= options.MinimumRSquared))
        {
            reason = string.Create(CultureInfo.InvariantCulture, $"the track does not follow the leading-order chirp law (weighted R^2 = {line.RSquared:F2} < {options.MinimumRSquared:F2})");
        }
        else
        {
            ok = true;
            reason = string.Create(CultureInfo.InvariantCulture, $"frequency rises as the leading-order chirp law predicts over {count} points (weighted R^2 = {line.RSquared:F2})");
        }

        var scope = ChirpScope.For(ok ? Finite(mc) : null, Finite(sigmaMc), t, f0, map, options);
        return new ChirpFit(Finite(mc), Finite(sigmaMc), Finite(tc), Finite(line.RSquared), ok, reason, t, f0, assumptions, scope);
    }

    private static double LocalMedian(List<double> f, int i, int first, int last)
    {
        var window = Enumerable.Range(Math.Max(first, i - 3), Math.Min(last, i + 3) - Math.Max(first, i - 3) + 1).Select(j => f[j]).Order().ToArray();
        return window[window.Length / 2];
    }

    /// <summary>σ_f of a ridge point: the full width 2 f √11 / Q of its tile's window, divided by √12 (a flat distribution across it).</summary>
    private static double Bandwidth(double f, double q) => 2 * f * Math.Sqrt(11) / q / Math.Sqrt(12);

    private static double? Finite(double v) => double.IsFinite(v) ? v : null;

    private static ChirpFit NoFit(string reason, double[] t, double[] f, List<string> assumptions) =>
        new(null, null, null, null, false, reason, t, f, assumptions, ["no chirp fit: the map says nothing about a chirp mass"]);
}
