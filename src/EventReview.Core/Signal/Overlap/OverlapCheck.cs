using System.Globalization;

namespace EventReview.Core.Signal.Overlap;

/// <summary>
/// Do two sites' whitened waveforms overlap after a shift and a possible sign flip? Both series are conditioned
/// (Welch PSD, whitening, zero-phase band-pass, notches), then the normalised correlation is computed in a window around
/// the candidate for every whole-sample lag within ±MaxLagSeconds, for both signs at once (ρ for sign −1 is −ρ).
/// </summary>
public static class OverlapCheck
{
    /// <summary>
    /// Runs the whole check on raw strain. Different sample rates in an integer ratio are handled by decimating the faster
    /// series (see <see cref="Resampling.ToCommonRate"/>); other ratios are refused. The two sites are conditioned in parallel.
    /// </summary>
    /// <param name="a">Strain of site A.</param>
    /// <param name="b">Strain of site B.</param>
    /// <param name="options">Check settings.</param>
    /// <param name="progress">Optional progress in [0, 1] (conditioning counts for 0.5, off-source overlaps for the rest).</param>
    /// <param name="cancellationToken">Cancels between stages and every 50 off-source overlaps.</param>
    /// <exception cref="ArgumentException">When the rates cannot be matched, the band is invalid or the centre is too close to
    /// the edge of either series.</exception>
    /// <exception cref="OperationCanceledException">When cancelled.</exception>
    public static OverlapResult Run(TimeSeries a, TimeSeries b, OverlapOptions options, IProgress<double>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(options);
        var (ra, rb, note) = Resampling.ToCommonRate(a, b);
        var cond = options.Conditioning ?? new ConditioningOptions();
        ConditionedSeries? ca = null, cb = null;
        cancellationToken.ThrowIfCancellationRequested();
        Parallel.Invoke(() => ca = Conditioning.Condition(ra, cond), () => cb = Conditioning.Condition(rb, cond));
        progress?.Report(0.5);
        var inner = progress is null ? null : new Progress<double>(v => progress.Report(0.5 + (0.5 * v)));
        return Compare(ca!, cb!, options, note, inner, cancellationToken);
    }

    /// <summary>
    /// Compares two already conditioned series of the same sample rate (lets callers reuse the conditioning for many checks).
    /// The correlation at lag k pairs A's sample i with B's sample at the same GPS time plus k samples; a peak at k means
    /// B arrives k samples later, so the reported lag is −k / fs (arrival(A) − arrival(B)), corrected for any sub-sample
    /// offset between the two sample grids.
    /// </summary>
    /// <param name="a">Conditioned series of site A.</param>
    /// <param name="b">Conditioned series of site B (same sample rate).</param>
    /// <param name="options">Check settings (the conditioning settings are only echoed in the assumptions).</param>
    /// <param name="resamplingNote">What was done about sample rates, copied to the result.</param>
    /// <param name="progress">Optional progress in [0, 1] over the off-source overlaps.</param>
    /// <param name="cancellationToken">Checked every 50 off-source overlaps.</param>
    /// <exception cref="ArgumentException">When the rates differ, or the on-source window and lags do not fit inside both valid ranges.</exception>
    /// <exception cref="OperationCanceledException">When cancelled.</exception>
    public static OverlapResult Compare(ConditionedSeries a, ConditionedSeries b, OverlapOptions options, string resamplingNote = "no resampling",
        IProgress<double>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        ArgumentNullException.ThrowIfNull(options);
        double fs = a.Data.SampleRateHz;
        if (Math.Abs(b.Data.SampleRateHz - fs) > 1e-9 * fs)
        {
            throw new ArgumentException("Both conditioned series must have the same sample rate.", nameof(b));
        }

        if (!(options.WindowSeconds > 0) || !(options.MaxLagSeconds >= 0) || options.OffSourceCount < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(options), "WindowSeconds must be positive, MaxLagSeconds and OffSourceCount not negative.");
        }

        var cond = options.Conditioning ?? new ConditioningOptions();
        int w = Math.Max(2, (int)Math.Round(options.WindowSeconds * fs));
        int maxLag = (int)Math.Floor((options.MaxLagSeconds * fs) + 1e-9);
        var ga = new Grid(a, b, options, fs, w, maxLag);
        var da = a.Data.Samples;
        var db = b.Data.Samples;
        var pa = WindowCorrelation.PrefixSquares(da);
        var pb = WindowCorrelation.PrefixSquares(db);
        var rho = new double[(2 * maxLag) + 1];
        WindowCorrelation.Compute(da, pa, ga.AStart, db, pb, ga.AStart + ga.Offset, w, maxLag, rho);

        int bestIdx = 0;
        for (int i = 1; i < rho.Length; i++)
        {
            if (Math.Abs(rho[i]) > Math.Abs(rho[bestIdx]))
            {
                bestIdx = i;
            }
        }

        int sign = rho[bestIdx] >= 0 ? 1 : -1;
        int altIdx = 0;
        for (int i = 1; i < rho.Length; i++)
        {
            if (-sign * rho[i] > -sign * rho[altIdx])
            {
                altIdx = i;
            }
        }

        double delta = 0;
        if (bestIdx > 0 && bestIdx < rho.Length - 1)
        {
            // Parabolic interpolation of the peak (e.g. Smith, "Spectral Audio Signal Processing", quadratic peak interpolation).
            double y0 = Math.Abs(rho[bestIdx - 1]), y1 = Math.Abs(rho[bestIdx]), y2 = Math.Abs(rho[bestIdx + 1]);
            double den = y0 - (2 * y1) + y2;
            delta = den < 0 ? Math.Clamp(0.5 * (y0 - y2) / den, -0.5, 0.5) : 0;
        }

        double LagOf(double k) => -((k / fs) + ga.ResidualSeconds);
        int bestK = bestIdx - maxLag;
        double overlap = Math.Abs(rho[bestIdx]);

        // Curve with ascending lag seconds: index i of rho has lag −(i − L)/fs, so reverse.
        var lags = new double[rho.Length];
        var curve = new double[rho.Length];
        for (int i = 0; i < rho.Length; i++)
        {
            lags[rho.Length - 1 - i] = LagOf(i - maxLag);
            curve[rho.Length - 1 - i] = rho[i];
        }

        var off = OffSource(ga, da, pa, db, pb, w, maxLag, options, progress, cancellationToken);
        progress?.Report(1);
        double? p = off.Length == 0 ? null : (1.0 + off.Count(v => v >= overlap)) / (1.0 + off.Length);
        var (pt, plotA, plotB) = Plot(ga, a, b, bestK, sign, options, fs);

        var assumptions = new List<string>
        {
            "lag = arrival(A) - arrival(B): add it to B's times (and multiply B by the sign) to line B up with A",
            "coefficient = sum(a b') / sqrt(sum a^2 sum b'^2) over the on-source window, both sums over the same window; lags searched on the sample grid",
            $"refined lag from a parabola through |rho| at the three nearest lags (sub-sample, ~0.1 sample typical error at high SNR); grid step {1e3 / fs:G4} ms",
            $"whitening by the Welch PSD of each series (periodic Hann, 50 % overlap, {cond.PsdSegmentSeconds:G} s segments), Tukey taper {cond.TaperSeconds:G} s at each end",
            $"zero-phase Butterworth band-pass order {cond.FilterOrder} (x2 forward-backward), {cond.LowHz:G}-{cond.HighHz:G} Hz" + ((cond.NotchFrequenciesHz?.Count ?? 0) > 0 ? ", notches at " + string.Join(", ", cond.NotchFrequenciesHz!.Select(f => f.ToString("G", CultureInfo.InvariantCulture))) + $" Hz (Q {cond.NotchQuality:G})" : string.Empty),
            "a sign flip of a narrow-band signal looks like a half-cycle shift: compare the alternative with the antenna-response check before choosing",
            off.Length == 0
                ? "no off-source overlaps computed: no p-value"
                : $"p-value = (1 + #off-source >= observed) / (1 + N) with N = {off.Length} time-slid window pairs (B's window moved by whole windows, at least {options.WindowSeconds:G} s, away from A's), statistic max |rho| over the same lags and both signs",
        };
        if (options.OffSourceCount > off.Length)
        {
            assumptions.Add($"only {off.Length} of the {options.OffSourceCount} off-source overlaps asked for fit in the data");
        }

        if (Math.Abs(ga.ResidualSeconds) > 1e-3 / fs)
        {
            assumptions.Add($"the two sample grids are offset by {ga.ResidualSeconds * 1e6:G4} us; lags include this offset");
        }

        return new OverlapResult(
            options.Center.ToString(), LagOf(bestK), LagOf(bestK + delta), sign, overlap,
            LagOf(altIdx - maxLag), -sign * rho[altIdx], lags, curve, fs, resamplingNote, off, p, pt, plotA, plotB,
            w / fs, maxLag / fs, cond.LowHz, cond.HighHz, assumptions);
    }

    private static double[] OffSource(Grid g, double[] da, double[] pa, double[] db, double[] pb, int w, int maxLag, OverlapOptions options,
        IProgress<double>? progress, CancellationToken cancellationToken)
    {
        if (options.OffSourceCount == 0)
        {
            return [];
        }

        var positions = new List<int>();
        double fs = g.SampleRateHz;
        double exclusion = (options.OffSourceExclusionSeconds * fs) + w;
        for (int p = g.Lo; p + w <= g.Hi; p += w)
        {
            if (Math.Abs(p + (w / 2) - g.CenterIndex) >= exclusion)
            {
                positions.Add(p);
            }
        }

        int count = positions.Count;
        var values = new List<double>(options.OffSourceCount);
        for (int s = 1; s < count && values.Count < options.OffSourceCount; s++)
        {
            for (int m = 0; m < count && values.Count < options.OffSourceCount; m++)
            {
                if (values.Count % 50 == 0)
                {
                    cancellationToken.ThrowIfCancellationRequested();
                    progress?.Report(values.Count / (double)options.OffSourceCount);
                }

                int j = (m + s) % count;
                values.Add(WindowCorrelation.MaxAbs(da, pa, positions[m], db, pb, positions[j] + g.Offset, w, maxLag));
            }
        }

        var arr = values.ToArray();
        Array.Sort(arr);
        return arr;
    }

    private static (double[] T, double[] A, double[] B) Plot(Grid g, ConditionedSeries a, ConditionedSeries b, int bestK, int sign, OverlapOptions options, double fs)
    {
        int half = (int)Math.Round(options.PlotSeconds * fs / 2);
        int shift = g.Offset + bestK;
        int i0 = Math.Max(Math.Max(g.CenterIndex - half, 0), -shift);
        int i1 = Math.Min(Math.Min(g.CenterIndex + half, a.Data.Length), b.Data.Length - shift);
        int stride = Math.Max(1, (int)Math.Ceiling((i1 - i0) / (double)Math.Max(1, options.MaxPlotPoints)));
        var t = new List<double>();
        var pa = new List<double>();
        var pb = new List<double>();
        double c = options.Center.SecondsSince(a.Data.Start);
        for (int i = i0; i < i1; i += stride)
        {
            t.Add((i / fs) - c);
            pa.Add(a.Data.Samples[i]);
            pb.Add(sign * b.Data.Samples[i + shift]);
        }

        return (t.ToArray(), pa.ToArray(), pb.ToArray());
    }

    private sealed class Grid
    {
        public Grid(ConditionedSeries a, ConditionedSeries b, OverlapOptions options, double fs, int w, int maxLag)
        {
            SampleRateHz = fs;
            double offsetExact = a.Data.Start.SecondsSince(b.Data.Start) * fs;
            Offset = (int)Math.Round(offsetExact);
            ResidualSeconds = b.Data.Start.SecondsSince(a.Data.Start) + (Offset / fs);
            CenterIndex = (int)Math.Round(options.Center.SecondsSince(a.Data.Start) * fs);
            AStart = CenterIndex - (w / 2);
            Lo = Math.Max(a.ValidStart, b.ValidStart - Offset + maxLag);
            Hi = Math.Min(a.ValidEnd, b.ValidEnd - Offset - maxLag);
            if (AStart < Lo || AStart + w > Hi)
            {
                throw new ArgumentException(
                    $"The window of {options.WindowSeconds:G} s around {options.Center} with lags of ±{options.MaxLagSeconds * 1e3:G} ms does not fit inside both series away from their tapered edges.",
                    nameof(options));
            }
        }

        public double SampleRateHz { get; }

        public int Offset { get; }

        public double ResidualSeconds { get; }

        public int CenterIndex { get; }

        public int AStart { get; }

        public int Lo { get; }

        public int Hi { get; }
    }
}
