using System.Globalization;
using EventReview.Core.Plots;
using EventReview.Core.Plots.Figures;
using EventReview.Core.Signal.TimeFrequency;
using EventReview.Core.Verdicts;
using EventReview.Core.Formatting;
using EventReview.Core.Inputs;

namespace EventReview.Core.Signal.Overlap;

/// <summary>
/// The overlap check kind in one call, for the app and the CLI alike: the overlap of two sites (<see cref="OverlapCheck"/>) searched
/// over the allowed lags, each site's Q map and chirp fit (<see cref="ChirpAnalysis"/>), one judgement with its reason, a summary line
/// and the pictures.
/// </summary>
public static class OverlapReview
{
    /// <summary>Runs the check kind.</summary>
    /// <param name="a">Site A (the reference).</param>
    /// <param name="b">Site B.</param>
    /// <param name="options">Window, allowed lag, conditioning, thresholds.</param>
    /// <param name="caseLagSeconds">arrival(A) − arrival(B) from the case's arrivals, shown for comparison (not judged); null when unknown.</param>
    /// <param name="progress">Optional progress in [0, 1] with what is being done.</param>
    /// <param name="cancellationToken">Cancels between stages and during the off-source overlaps.</param>
    /// <exception cref="ArgumentException">When the data cannot be compared (rates, band, window outside the data).</exception>
    /// <exception cref="OperationCanceledException">When cancelled.</exception>
    public static OverlapReviewResult Run(OverlapReviewSite a, OverlapReviewSite b, OverlapReviewOptions options, double? caseLagSeconds = null,
        Action<double, string>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        ArgumentNullException.ThrowIfNull(options);
        var ci = CultureInfo.InvariantCulture;
        var core = new OverlapOptions(options.Center, options.WindowSeconds, options.AllowedLagSeconds, options.Conditioning, options.OffSourceTrials);
        var reporter = progress is null ? null : new Reporter(v => progress(0.8 * v,
            v < 0.5 ? "whitening and band-passing both sites"
            : options.OffSourceTrials == 0 ? "correlating" : string.Create(ci, $"off-source overlap {(int)Math.Round((v - 0.5) * 2 * options.OffSourceTrials):N0} of {options.OffSourceTrials:N0}")));
        var overlap = OverlapCheck.Run(a.Strain, b.Strain, core, reporter, cancellationToken);

        var maps = new List<(OverlapSiteMap Summary, string[] Svg)>();
        foreach (var (site, i) in new[] { (a, 0), (b, 1) })
        {
            cancellationToken.ThrowIfCancellationRequested();
            progress?.Invoke(0.82 + (0.08 * i), $"time-frequency map and chirp fit of {site.Code}");
            maps.Add(Map(site, options));
        }

        bool atEdge = overlap.AtSearchEdge;
        bool within = Math.Abs(overlap.RefinedLagSeconds) <= options.AllowedLagSeconds + 1e-9 && !atEdge;
        var judgement = Judge(overlap, within, atEdge, options);
        var signNote = SignNote(overlap, a.Code, b.Code);
        var result = new OverlapReviewResult(a.Code, b.Code, a.FileName, b.FileName, overlap, options.AllowedLagSeconds, options.AllowedLagRule, caseLagSeconds,
            within, atEdge, options.OverlapThreshold, options.PValueThreshold, signNote, judgement.Reason, maps.Select(m => m.Summary).ToList(),
            [
                string.Create(ci, $"overlap threshold {options.OverlapThreshold:0.##}: our default, not a published value; noise limits the overlap of a matched signal to about rho^2/(rho^2 + N) for N independent samples in the window (about 2 x bandwidth x window), so the off-source p-value carries the significance"),
                string.Create(ci, $"consistent = overlap >= {options.OverlapThreshold:0.##}, lag inside ±{options.AllowedLagSeconds * 1e3:0.00} ms and not within one sample of the search limit, and p <= {ScientificFormat.Format(options.PValueThreshold, 3)} when off-source overlaps were run; concern when only the p-value fails; the lag's uncertainty and the phase are reported, not judged"),
                "allowed lag: " + options.AllowedLagRule,
                string.Create(ci, $"time-frequency maps: multi-resolution Q transform (Chatterji et al. 2004) of whitened strain, Q {new QTransformOptions().QMin:0}-{new QTransformOptions().QMax:0}, mismatch {new QTransformOptions().MaxMismatch:0.##}, the same at every site, from {options.MapBeforeSeconds:0.##} s before to {options.MapAfterSeconds:0.##} s after the candidate; colour = power / median, capped at the 99.5th percentile"),
                "the phase says how B is turned against A; whether the sites' orientations allow the sign it implies is the antenna-response part of the timing check",
            ])
        {
            Judgement = judgement,
        };
        var pictures = new List<string>
        {
            PlotSvg.Write(OverlapFigures.Overlay(overlap, a.Code, b.Code)),
            PlotSvg.Write(OverlapFigures.CorrelationCurve(overlap)),
            PlotSvg.Write(OverlapFigures.OffSourceHistogram(overlap)),
        };
        pictures.AddRange(maps.SelectMany(m => m.Svg));
        var cond = options.Conditioning;
        pictures.Add(PlotSvg.Write(AsdFigure.Build([(a.Code, Conditioning.EstimatePsd(a.Strain, cond)), (b.Code, Conditioning.EstimatePsd(b.Strain, cond))], cond.LowHz, cond.HighHz)));
        return result with { Summary = Summarise(result), PicturesSvg = pictures };
    }

    /// <summary>One line with the key numbers, their uncertainty and the window they were judged against.</summary>
    public static string Summarise(OverlapReviewResult r)
    {
        ArgumentNullException.ThrowIfNull(r);
        var ci = CultureInfo.InvariantCulture;
        var o = r.Overlap;
        string sigma = o.LagUncertaintySeconds is { } s ? string.Create(ci, $" ± {s * 1e3:0.00}") : string.Empty;
        string phase = o.PhaseRadians is { } ph
            ? string.Create(ci, $", phase {double.RadiansToDegrees(ph):0}°{(o.PhaseUncertaintyRadians is { } ps ? string.Create(ci, $" ± {double.RadiansToDegrees(ps):0}°") : string.Empty)} ({(o.SignDetermined == false ? "sign undetermined" : o.Sign > 0 ? "sign +1" : "sign −1")})")
            : string.Create(ci, $", sign {(o.Sign > 0 ? "+1" : "−1")}");
        var text = string.Create(ci, $"{r.SiteA}–{r.SiteB}: overlap {o.Overlap:0.00} at lag {Ms(o.RefinedLagSeconds)}{sigma} ms (allowed ±{r.AllowedLagSeconds * 1e3:0.00} ms){phase}");
        text += o.PValue is { } p
            ? string.Create(ci, $"; p = {ScientificFormat.Format(p, 2)} ({o.OffSourceOverlaps.Length} off-source trials)")
            : "; no off-source trials";
        return text;
    }

    private static string Ms(double seconds) => (seconds * 1e3).ToString("+0.00;−0.00", CultureInfo.InvariantCulture);

    private static Judgement Judge(OverlapResult o, bool within, bool atEdge, OverlapReviewOptions p)
    {
        var ci = CultureInfo.InvariantCulture;
        var problems = new List<string>();
        if (o.Overlap < p.OverlapThreshold)
        {
            problems.Add(string.Create(ci, $"overlap {o.Overlap:0.00} is below {p.OverlapThreshold:0.##}"));
        }

        if (!within)
        {
            problems.Add(atEdge
                ? string.Create(ci, $"the best lag {Ms(o.RefinedLagSeconds)} ms is within one sample of the search limit ±{o.MaxLagSeconds * 1e3:0.00} ms (the peak may lie outside the allowed window)")
                : string.Create(ci, $"the lag {Ms(o.RefinedLagSeconds)} ms is outside the allowed ±{p.AllowedLagSeconds * 1e3:0.00} ms"));
        }

        bool weakP = o.PValue is { } pv && pv > p.PValueThreshold;
        string sigma = o.LagUncertaintySeconds is { } s ? string.Create(ci, $" ± {s * 1e3:0.00}") : string.Empty;
        if (problems.Count == 0 && !weakP)
        {
            var pText = o.PValue is { } q
                ? string.Create(ci, $", p = {ScientificFormat.Format(q, 2)} ≤ {ScientificFormat.Format(p.PValueThreshold, 3)}")
                : ", no off-source p-value asked";
            return new Judgement(Verdict.Consistent, string.Create(ci,
                $"overlap {o.Overlap:0.00} ≥ {p.OverlapThreshold:0.##}, lag {Ms(o.RefinedLagSeconds)}{sigma} ms inside ±{p.AllowedLagSeconds * 1e3:0.00} ms") + pText);
        }

        if (problems.Count == 0)
        {
            return new Judgement(Verdict.Concern, string.Create(ci,
                $"overlap and lag pass, but off-source noise reaches this overlap too often: p = {ScientificFormat.Format(o.PValue ?? double.NaN, 2)} > {ScientificFormat.Format(p.PValueThreshold, 3)}"));
        }

        if (weakP)
        {
            problems.Add(string.Create(ci, $"p = {ScientificFormat.Format(o.PValue ?? double.NaN, 2)} > {ScientificFormat.Format(p.PValueThreshold, 3)}"));
        }

        return new Judgement(Verdict.Inconsistent, string.Join("; ", problems));
    }

    private static string SignNote(OverlapResult o, string a, string b)
    {
        var ci = CultureInfo.InvariantCulture;
        if (o.PhaseRadians is not { } phase)
        {
            return o.Sign > 0 ? $"sign +1: {b} lines up with {a} as it is" : $"sign −1: {b} is flipped to line up with {a}";
        }

        string turn = string.Create(ci, $"{b} is turned by {double.RadiansToDegrees(phase):0}°{(o.PhaseUncertaintyRadians is { } s ? string.Create(ci, $" ± {double.RadiansToDegrees(s):0}°") : string.Empty)} against {a}");
        return o.SignDetermined == false
            ? turn + ": too close to ±90° to prefer a sign; the overlap with a sign flip alone would be " + o.SignOnlyOverlap?.ToString("0.00", ci)
            : turn + (o.Sign > 0 ? ": sign +1 (as recorded)" : ": sign −1 (flipped)") + string.Create(ci, $"; a sign flip alone (no phase turn) reaches overlap {o.SignOnlyOverlap:0.00}");
    }

    private static (OverlapSiteMap Summary, string[] Svg) Map(OverlapReviewSite site, OverlapReviewOptions options)
    {
        var q = new QTransformOptions();
        try
        {
            var r = ChirpAnalysis.Run(site.Strain, options.Center, options.MapBeforeSeconds, options.MapAfterSeconds, q);
            var peak = r.Map.Loudest();
            var summary = new OverlapSiteMap(site.Code, site.FileName, r.Fit, null, r.Map.TimesSeconds[0], r.Map.TimesSeconds[^1], r.Map.FrequenciesHz[0],
                r.Map.FrequenciesHz[^1], 0, 0, peak.Energy, peak.TimeSeconds, peak.FrequencyHz, peak.Q, r.Map.QPlanes[0], r.Map.QPlanes[^1], r.Map.MaxMismatch,
                r.Map.Percentile(0.995));
            return (summary, [PlotSvg.Write(QMapFigure.Build(r.Map, r.Fit, site.Code)), PlotSvg.Write(QMapFigure.Build(r.Zoom, r.Fit, site.Code, "zoom on the last part of the signal"))]);
        }
        catch (ArgumentException ex)
        {
            return (new OverlapSiteMap(site.Code, site.FileName, null, UserMessage.From(ex), 0, 0, 0, 0, 0, 0, 0, 0, 0), []);
        }
    }

    /// <summary>Reports on the calling thread (no synchronisation-context hop, so values arrive in order).</summary>
    private sealed class Reporter(Action<double> report) : IProgress<double>
    {
        public void Report(double value) => report(value);
    }
}
