using System.Diagnostics;
using System.Globalization;
using EventReview.Core.Verdicts;
using EventReview.Core.Inputs;

namespace EventReview.Core.Significance;

/// <summary>
/// The background check as the app and the CLI run it: every pair of sites slid on its own (Was et al. 2010, Class. Quantum
/// Grav. 27 015005), and for exactly three sites also the three-site background (<see cref="TripleTimeSlides"/>, each pair
/// with its own window) combined with the pairs into a joint significance (<see cref="JointSignificance"/>). The verdict is
/// the significance band, a neutral statement; a background too short to reach 3 sigma is a concern.
/// </summary>
public static class BackgroundCheck
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Runs the check.</summary>
    /// <param name="sites">The sites' triggers and analysed time, keyed by code as in <paramref name="plans"/>.</param>
    /// <param name="plans">One plan per pair (from <see cref="BackgroundPlanner.Pairs"/>).</param>
    /// <param name="settings">Step, slides, candidate and storage settings.</param>
    /// <param name="progress">Called with (fraction 0..1, sentence) as the slides are searched.</param>
    /// <param name="cancellationToken">Cancels the search.</param>
    /// <exception cref="ArgumentException">When a step is not much longer than a window, a site is missing, or a candidate cannot be found.</exception>
    public static BackgroundCheckResult Run(IReadOnlyDictionary<string, SiteTriggers> sites, IReadOnlyList<BackgroundPairPlan> plans, BackgroundCheckSettings settings,
        Action<double, string>? progress = null, CancellationToken cancellationToken = default)
    {
        ArgumentNullException.ThrowIfNull(sites);
        ArgumentNullException.ThrowIfNull(plans);
        ArgumentNullException.ThrowIfNull(settings);
        if (plans.Count == 0)
        {
            throw new ArgumentException("The background check needs at least two sites.", nameof(plans));
        }

        foreach (var plan in plans)
        {
            BackgroundPlanner.RequireStepMuchLongerThanWindow(settings.StepSeconds, plan.WindowMs, plan.Name);
        }

        var codes = plans.SelectMany(p => new[] { p.SiteA, p.SiteB }).Distinct().OrderBy(c => c, StringComparer.Ordinal).ToList();
        var steps = plans.Count + (codes.Count == 3 ? 1 : 0);
        var watch = Stopwatch.StartNew();
        var notes = new List<string>();
        TripleBackgroundResult? triple = null;
        if (codes.Count == 3)
        {
            try
            {
                triple = RunTriple(codes, sites, plans, settings, Reporter(progress, 0, steps, $"triple {string.Join("–", codes)}: ", watch), cancellationToken);
            }
            catch (ArgumentException ex)
            {
                notes.Add($"three-site background not computed: {UserMessage.From(ex)}; the pairs are reported on their own");
            }
        }

        var pairs = new List<BackgroundPairOutcome>();
        for (var i = 0; i < plans.Count; i++)
        {
            var plan = plans[i];
            var label = plans.Count > 1 ? $"pair {i + 1} of {plans.Count} ({plan.Name}): " : string.Empty;
            var pairWatch = Stopwatch.StartNew();
            var result = TimeSlideBackground.Run(Site(sites, plan.SiteA), Site(sites, plan.SiteB), Options(plan, settings, triple?.CandidateStatistic),
                Reporter(progress, i + (triple is null ? 0 : 1), steps, label, watch), cancellationToken);
            pairs.Add(Judge(plan, result with { Curve = Decimate(result.Curve, settings.CurvePoints) }, Math.Round(pairWatch.Elapsed.TotalSeconds, 3)));
        }

        var joint = triple is null ? null : JointSignificance.Combine(triple.CandidateStatistic,
        [
            .. pairs.Select(p => new CoincidenceTypeBackground(p.Plan.Name, p.Result.LouderThanJoint, p.Result.BackgroundSeconds, p.Result.ObservingTimeSeconds)),
            new CoincidenceTypeBackground(string.Join("–", triple.Sites), triple.Figures.Louder, triple.BackgroundSeconds, triple.ObservingTimeSeconds),
        ]);
        var headline = pairs.Select((p, i) => (p, i)).OrderByDescending(x => x.p.Result.FarHz).ThenBy(x => x.i).First().i;
        return new BackgroundCheckResult(pairs, triple, triple is null ? null : settings.TripleStatisticRule, joint, headline,
            Overall(pairs, headline, joint), Method(settings, triple is not null), notes);
    }

    /// <summary>The Core options used for a pair (public so that a reader can recompute the stored numbers exactly).</summary>
    public static TimeSlideOptions Options(BackgroundPairPlan plan, BackgroundCheckSettings settings, double? jointStatistic)
    {
        ArgumentNullException.ThrowIfNull(plan);
        ArgumentNullException.ThrowIfNull(settings);
        return TimeSlideOptions.Create(plan.WindowMs, settings.StepSeconds, settings.Slides) with
        {
            CandidateStatistic = plan.CandidateStatistic ?? double.PositiveInfinity,
            JointStatistic = jointStatistic ?? double.PositiveInfinity,
            ObservingTimeSeconds = settings.ObservingTimeSeconds,
            RemoveCandidateTriggers = settings.RemoveCandidateTriggers,
            CandidateTime = settings.Arrivals.TryGetValue(plan.SiteA, out var t) ? t : settings.CandidateTime,
            ChirpMassRelativeTolerance = settings.ChirpMassRelativeTolerance,
            LoudestCount = settings.LoudestCount,
        };
    }

    private static TripleBackgroundResult RunTriple(List<string> codes, IReadOnlyDictionary<string, SiteTriggers> sites, IReadOnlyList<BackgroundPairPlan> plans,
        BackgroundCheckSettings settings, IProgress<BackgroundProgress>? progress, CancellationToken ct)
    {
        double WindowMs(string a, string b) => plans.Single(p => (p.SiteA == a && p.SiteB == b) || (p.SiteA == b && p.SiteB == a)).WindowMs;
        var windows = TripleWindows.FromMilliseconds(WindowMs(codes[0], codes[1]), WindowMs(codes[0], codes[2]), WindowMs(codes[1], codes[2]));
        var options = TimeSlideOptions.Create(windows.FirstSecondNs / 1e6, settings.StepSeconds, settings.Slides) with
        {
            CandidateStatistic = settings.TripleStatistic ?? double.PositiveInfinity,
            ObservingTimeSeconds = settings.ObservingTimeSeconds,
            RemoveCandidateTriggers = settings.RemoveCandidateTriggers,
            CandidateTime = settings.Arrivals.TryGetValue(codes[0], out var t) ? t : settings.CandidateTime,
            ChirpMassRelativeTolerance = settings.ChirpMassRelativeTolerance,
            LoudestCount = settings.LoudestCount,
        };
        return TripleTimeSlides.Run(Site(sites, codes[0]), Site(sites, codes[1]), Site(sites, codes[2]), options, progress, windows, ct);
    }

    private static BackgroundPairOutcome Judge(BackgroundPairPlan plan, BackgroundResult r, double elapsedSeconds)
    {
        var figures = new SignificanceFigures(r.BackgroundCoincidences, r.Louder, r.FarHz, r.FarIsBound, r.Fap, r.Sigma, r.FarBoundConfidence);
        return new BackgroundPairOutcome(plan, r, SignificanceBand.Word(r.Sigma, r.SigmaIsBound), SignificanceBand.MaxReachableSigma(r.BackgroundSeconds, r.ObservingTimeSeconds),
            SignificanceBand.Judge(figures, r.BackgroundSeconds, r.ObservingTimeSeconds, plan.Name), elapsedSeconds);
    }

    private static Judgement Overall(List<BackgroundPairOutcome> pairs, int headline, JointSignificanceResult? joint)
    {
        var concerns = pairs.Where(p => p.Judgement.Verdict == Verdict.Concern).ToList();
        if (joint is not null)
        {
            var extra = concerns.Count > 0 ? " Pair backgrounds too short: " + string.Join(" ", concerns.Select(c => c.Judgement.Reason)) : string.Empty;
            return joint.Judgement with { Reason = joint.Judgement.Reason + extra };
        }

        if (concerns.Count > 0)
        {
            return new Judgement(Verdict.Concern, string.Join(" ", concerns.Select(c => c.Judgement.Reason)));
        }

        var h = pairs[headline];
        return pairs.Count == 1 ? h.Judgement : h.Judgement with { Reason = $"least significant of {pairs.Count} pairs, " + h.Judgement.Reason };
    }

    private static List<string> Method(BackgroundCheckSettings s, bool triple)
    {
        var list = new List<string>
        {
            "Time slides as in Was et al. 2010, Class. Quantum Grav. 27 015005: the second site of each pair (by code) is moved by k × step, k = ±1..±K, on a ring over the analysed span; zero lag is never background.",
            triple
                ? "Three sites: each pair is slid on its own, and the three-site background slides the second site by k and the third by 2k steps, each pair of sites with its own window; the joint figure sums the rates of every coincidence type at the candidate's three-site statistic (Davies et al. 2020, from memory)."
                : "Each pair of sites is analysed on its own. The verdict quotes the least significant pair (largest FAR) to stay conservative; no trials factor for the number of pairs, searches or pipelines is applied.",
            string.Create(Inv, $"Step ≥ {BackgroundPlanner.MinStepOverWindow:0} × window is required (slides stay independent; common practice)."),
            "Verdict: the significance band (below 3 sigma, 3 to 5 sigma, 5 sigma or more; one-sided Gaussian) as a statement, not a pass or fail. When nothing in the background is as loud, the FAR is a 90 % upper bound (2.3026 / background time, Gehrels 1986), the FAP an upper bound and the sigma a lower bound: 'at least 3 sigma' when that bound lies from 3 to 5, and a concern when the background is too short for the bound to reach 3 sigma. Whether the candidate is a detection is for people to decide.",
            "Slide p-value (m + 1) / (2K + 1) with m the slides holding a coincidence as loud (North, Curtis and Sham 2002); with m = 0 it is the floor, an upper bound (≤).",
            s.RemoveCandidateTriggers
                ? "Both are reported: the background with every coincidence included, and without any coincidence that uses one of the candidate's own triggers (the zero-lag coincidence nearest the arrival)."
                : "The candidate's own triggers were left in the background.",
            string.Create(Inv, $"Per year = × {SignificanceText.SecondsPerYear:0} s (Julian year). Curve stored at ≤ {s.CurvePoints} points; the {s.LoudestCount} loudest background coincidences are kept."),
        };
        return list;
    }

    private static SiteTriggers Site(IReadOnlyDictionary<string, SiteTriggers> sites, string code) =>
        sites.TryGetValue(code, out var s) ? s : throw new ArgumentException($"No triggers were given for site {code}.", nameof(sites));

    private static SyncProgress? Reporter(Action<double, string>? progress, int index, int steps, string label, Stopwatch watch) =>
        progress is null ? null : new SyncProgress(p => progress(
            (index + p.Fraction) / steps,
            string.Create(Inv, $"{label}slide {p.SlidesDone:N0} of {p.SlidesTotal:N0}, {p.CoincidencesFound:N0} coincidences, {watch.Elapsed.TotalSeconds:F1} s")));

    /// <summary>Keeps at most <paramref name="max"/> points, evenly spread in log(count), always the first and last.</summary>
    private static List<BackgroundCurvePoint> Decimate(IReadOnlyList<BackgroundCurvePoint> curve, int max)
    {
        if (curve.Count <= max || max < 3)
        {
            return [.. curve];
        }

        // curve is by increasing statistic, so decreasing count
        var step = (Math.Log(curve[0].Count) - Math.Log(curve[^1].Count)) / (max - 2);
        var kept = new List<BackgroundCurvePoint> { curve[0] };
        for (var i = 1; i < curve.Count - 1; i++)
        {
            if (Math.Log(kept[^1].Count) - Math.Log(curve[i].Count) >= step)
            {
                kept.Add(curve[i]);
            }
        }

        kept.Add(curve[^1]);
        return kept;
    }

    /// <summary>Reports synchronously on the searching thread (Progress&lt;T&gt; would post to a context).</summary>
    private sealed class SyncProgress(Action<BackgroundProgress> report) : IProgress<BackgroundProgress>
    {
        public void Report(BackgroundProgress value) => report(value);
    }
}
