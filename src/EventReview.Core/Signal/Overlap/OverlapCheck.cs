using System.Globalization;
using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Signal.Overlap;

/// <summary>
/// Do two sites' whitened waveforms overlap after a shift and a phase (or sign) change? Both series are conditioned (median-averaged
/// Welch PSD, whitening, zero-phase band-pass, notches), turned into analytic signals, and their complex correlation
/// Z(k) = Σ conj(â) b̂ₖ is computed in a window around the candidate for every whole-sample lag within ±MaxLagSeconds. The envelope
/// |Z| gives the lag (refined by a parabola) free of the phase; arg Z gives the phase; the lag's one-sigma uncertainty comes from
/// the envelope's curvature and the measured noise of its slope (see the assumptions of the result).
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
    /// Compares two already conditioned series of the same sample rate. The correlation at shift k pairs A's sample i with B's
    /// sample at the same GPS time plus k samples; a peak at k means B arrives k samples later, so the reported lag is −k / fs
    /// (arrival(A) − arrival(B)), corrected for any sub-sample offset between the two sample grids.
    /// </summary>
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

        if (!(options.WindowSeconds > 0) || !(options.MaxLagSeconds >= 0) || options.OffSourceCount < 0 || !(options.SignMarginDegrees is >= 0 and < 90))
        {
            throw new ArgumentOutOfRangeException(nameof(options), "WindowSeconds must be positive, MaxLagSeconds and OffSourceCount not negative, SignMarginDegrees in [0, 90).");
        }

        var cond = options.Conditioning ?? new ConditioningOptions();
        int w = Math.Max(2, (int)Math.Round(options.WindowSeconds * fs));
        int maxLag = (int)Math.Floor((options.MaxLagSeconds * fs) + 1e-9);
        var grid = new OverlapGrid(a, b, options, fs, w, maxLag);
        var za = AnalyticSignal.Of(a.Data.Samples);
        var zb = AnalyticSignal.Of(b.Data.Samples);
        var pa = ComplexCorrelation.PrefixPower(za);
        var pb = ComplexCorrelation.PrefixPower(zb);
        int lags = (2 * maxLag) + 1;
        var re = new double[lags];
        var im = new double[lags];
        int bStart = grid.AStart + grid.Offset;
        ComplexCorrelation.Lags(za, grid.AStart, zb, bStart, w, maxLag, re, im);
        var envelope = new double[lags];
        var magnitude = new double[lags];
        var real = new double[lags];
        int best = 0;
        for (int i = 0; i < lags; i++)
        {
            double norm = ComplexCorrelation.Norm(pa, grid.AStart, pb, bStart, i - maxLag, w);
            magnitude[i] = Math.Sqrt((re[i] * re[i]) + (im[i] * im[i]));
            envelope[i] = norm > 0 ? magnitude[i] / norm : 0;
            real[i] = norm > 0 ? re[i] / norm : 0;
            best = magnitude[i] > magnitude[best] ? i : best;
        }

        // Least-squares parabola through the envelope over its peak (see EnvelopePeak); Re Z and Im Z are interpolated with a
        // three-point parabola around the nearest whole shift for the phase at the refined lag.
        var fit = EnvelopePeak.Locate(magnitude, best);
        best = fit?.Centre ?? best;
        double delta = fit?.Delta ?? 0;
        int near = Math.Clamp(best + (int)Math.Round(delta), 1, Math.Max(1, lags - 2));
        double frac = lags >= 3 ? best + delta - near : 0;
        double Interp(double[] f) => lags < 3 ? f[best] : f[near] + (0.5 * frac * (f[near + 1] - f[near - 1])) + (0.5 * frac * frac * (f[near + 1] - (2 * f[near]) + f[near - 1]));
        double phase = Math.Atan2(Interp(im), Interp(re));
        int bestK = best - maxLag;
        double refined = grid.LagOf(bestK + delta);
        var spread = fit is { } f0 ? EnvelopePeak.Spread(za, zb, grid, f0, re, im) : null;
        double? sigma = spread?.Sigma / fs;
        int sign = Math.Cos(phase) >= 0 ? 1 : -1;

        // The sign is determined when the phase stays clear of ±90° by the margin and by two of its own sigmas.
        double clearance = Math.Abs((Math.PI / 2) - Math.Abs(phase));
        bool signDetermined = clearance >= Math.Max(double.DegreesToRadians(options.SignMarginDegrees), 2 * (spread?.PhaseSigma ?? 0));
        bool atEdge = lags > 1 && Math.Abs(refined) >= (maxLag - 1) / fs;

        // Curves with ascending lag seconds: index i has shift i − L, i.e. lag −(i − L)/fs, so reverse.
        var lagAxis = new double[lags];
        var curve = new double[lags];
        var env = new double[lags];
        for (int i = 0; i < lags; i++)
        {
            lagAxis[lags - 1 - i] = grid.LagOf(i - maxLag);
            curve[lags - 1 - i] = real[i];
            env[lags - 1 - i] = envelope[i];
        }

        double overlap = envelope[best];
        var off = OffSource(grid, za, pa, zb, pb, options, progress, cancellationToken);
        progress?.Report(1);
        double statistic = envelope.Max();
        double? p = off.Length == 0 ? null : (1.0 + off.Count(v => v >= statistic)) / (1.0 + off.Length);
        var (pt, plotA, plotB) = Plot(grid, a, za, zb, bestK, phase, options);
        var warnings = Warnings(atEdge, signDetermined, sigma, phase, spread?.PhaseSigma, options, grid);
        if (spread is { CurvatureNoise: > EnvelopePeak.ResolvedLimit } sp)
        {
            warnings.Add(string.Create(CultureInfo.InvariantCulture,
                $"the correlation peak is barely resolved (its curvature is uncertain by {sp.CurvatureNoise:P0}): at this signal-to-noise ratio the ± interval of the lag is too narrow; read it as a lower bound"));
        }
        return new OverlapResult(
            options.Center.ToString(), grid.LagOf(bestK), refined, sign, overlap, lagAxis, curve, fs, resamplingNote, off, p, pt, plotA, plotB,
            w / fs, maxLag / fs, cond.LowHz, cond.HighHz, OverlapAssumptions.For(options, cond, fs, off.Length, grid.ResidualSeconds),
            sigma, phase, signDetermined, overlap * Math.Abs(Math.Cos(phase)), env, atEdge, warnings, spread?.PhaseSigma);
    }

    private static List<string> Warnings(bool atEdge, bool signDetermined, double? sigma, double phase, double? phaseSigma, OverlapOptions options, OverlapGrid grid)
    {
        var ci = CultureInfo.InvariantCulture;
        var warnings = new List<string>();
        if (atEdge)
        {
            warnings.Add(string.Create(ci, $"the best lag lies within one sample of the search limit (±{options.MaxLagSeconds * 1e3:0.###} ms): the true peak may lie outside the searched lags"));
        }

        if (!signDetermined)
        {
            warnings.Add(string.Create(ci, $"sign undetermined: the phase {double.RadiansToDegrees(phase):0}° ± {double.RadiansToDegrees(phaseSigma ?? 0):0}° lies within {options.SignMarginDegrees:0}° (or two of its sigmas) of ±90°, so neither sign lines B up with A clearly better than the other; do not feed a sign from this check into the antenna-response test"));
        }

        if (sigma is null)
        {
            warnings.Add(grid.NoisePositions.Count < EnvelopePeak.MinimumWindows
                ? $"no lag uncertainty: only {grid.NoisePositions.Count} off-source windows fit in the data (at least {EnvelopePeak.MinimumWindows} are needed)"
                : "no lag uncertainty: the correlation envelope has no curved peak inside the searched lags");
        }

        return warnings;
    }

    private static double[] OffSource(OverlapGrid g, AnalyticSeries za, double[] pa, AnalyticSeries zb, double[] pb, OverlapOptions options,
        IProgress<double>? progress, CancellationToken cancellationToken)
    {
        if (options.OffSourceCount == 0)
        {
            return [];
        }

        var positions = g.OffSourcePositions;
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
                values.Add(ComplexCorrelation.MaxEnvelope(za, pa, positions[m], zb, pb, positions[j] + g.Offset, g.Window, g.MaxLag));
            }
        }

        var arr = values.ToArray();
        Array.Sort(arr);
        return arr;
    }

    private static (double[] T, double[] A, double[] B) Plot(OverlapGrid g, ConditionedSeries a, AnalyticSeries za, AnalyticSeries zb, int bestK, double phase, OverlapOptions options)
    {
        double fs = g.SampleRateHz;
        int half = (int)Math.Round(options.PlotSeconds * fs / 2);
        int shift = g.Offset + bestK;
        int i0 = Math.Max(Math.Max(g.CenterIndex - half, 0), -shift);
        int i1 = Math.Min(Math.Min(g.CenterIndex + half, za.Length), zb.Length - shift);
        int stride = Math.Max(1, (int)Math.Ceiling((i1 - i0) / (double)Math.Max(1, options.MaxPlotPoints)));
        var (s, c) = Math.SinCos(phase);
        var t = new List<double>();
        var pa = new List<double>();
        var pb = new List<double>();
        double centre = options.Center.SecondsSince(a.Data.Start);
        for (int i = i0; i < i1; i += stride)
        {
            t.Add((i / fs) - centre);
            pa.Add(za.Real[i]);
            pb.Add((zb.Real[i + shift] * c) + (zb.Imaginary[i + shift] * s));
        }

        return (t.ToArray(), pa.ToArray(), pb.ToArray());
    }
}
