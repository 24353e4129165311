using System.Globalization;

namespace EventReview.Core.Signal.Overlap;

/// <summary>The plain statements stored with every overlap result.</summary>
internal static class OverlapAssumptions
{
    public static List<string> For(OverlapOptions options, ConditioningOptions cond, double fs, int offSourceCount, double gridResidualSeconds)
    {
        var ci = CultureInfo.InvariantCulture;
        var list = new List<string>
        {
            "lag = arrival(A) - arrival(B): add it to B's times (and turn B by -phase, or multiply by the sign) to line B up with A",
            "analytic signals â = a + i H(a) (Hilbert transform by FFT); Z(k) = Σ conj(â) b̂ over the on-source window for B shifted by k samples; overlap = |Z| / sqrt(Σ|â|² Σ|b̂|²) with both sums over the same window",
            string.Create(ci, $"lag from the peak of |Z| (free of the phase between the sites), refined by a parabola through the three nearest lags; grid step {1e3 / fs:G4} ms; phase = arg Z at the refined lag"),
            "lag uncertainty (1σ) = sqrt(Var |Z|') / |Z|'': the envelope's curvature at the peak and the variance of its slope measured on off-source windows (signal × noise and noise × noise terms); stationary Gaussian noise and a resolved peak assumed; at high SNR it equals the Cramér–Rao form 1 / (2π Δf_rms ρ)",
            string.Create(ci, $"sign = sign of cos(phase); undetermined when the phase lies within {options.SignMarginDegrees:G}° (our margin) or two of its sigmas of ±90°; the phase's sigma includes the lag's error times its turn per second; a phase that is not 0 or 180° is what two differently oriented sites see from an inclined binary"),
            string.Create(ci, $"whitening by the Welch PSD of each series ({cond.PsdAverage.ToString().ToLowerInvariant()} of periodic-Hann periodograms, 50 % overlap, {cond.PsdSegmentSeconds:G} s segments: a loud signal in a few segments does not raise the noise estimate), Tukey taper {cond.TaperSeconds:G} s at each end"),
            string.Create(ci, $"zero-phase Butterworth band-pass order {cond.FilterOrder} (x2 forward-backward), {cond.LowHz:G}-{cond.HighHz:G} Hz")
                + ((cond.NotchFrequenciesHz?.Count ?? 0) > 0 ? ", notches at " + string.Join(", ", cond.NotchFrequenciesHz!.Select(f => f.ToString("G", ci))) + string.Create(ci, $" Hz (Q {cond.NotchQuality:G})") : string.Empty),
            offSourceCount == 0
                ? "no off-source overlaps computed: no p-value"
                : string.Create(ci, $"p-value = (1 + #off-source >= observed) / (1 + N) with N = {offSourceCount} time-slid window pairs (B's window moved by whole windows, at least {options.WindowSeconds:G} s, away from A's), statistic max overlap over the same lags"),
        };
        if (options.OffSourceCount > offSourceCount)
        {
            list.Add(string.Create(ci, $"only {offSourceCount} of the {options.OffSourceCount} off-source overlaps asked for fit in the data"));
        }

        if (Math.Abs(gridResidualSeconds) > 1e-3 / fs)
        {
            list.Add(string.Create(ci, $"the two sample grids are offset by {gridResidualSeconds * 1e6:G4} us; lags include this offset"));
        }

        return list;
    }
}
