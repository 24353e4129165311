using System.Globalization;
using EventReview.Core.Injections;
using EventReview.Core.Statistics;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;
using EventReview.Core.Formatting;

namespace EventReview.Core.Environment;

/// <summary>
/// Veto safety: does a channel respond to hardware injections? A channel that does could also respond to a real signal,
/// so it must not be used to veto. Each performed injection is one trial: it is coincident when the channel has a trigger
/// within ±w of its span. By chance alone that happens with q = 1 - exp(-R (2 w + d)) for a channel of rate R (a Poisson
/// stream), so the number of coincident injections K is binomial, K ~ Binomial(n, q), and at most n. The channel is
/// unsafe when P(K &gt;= k) falls below the threshold.
/// </summary>
public static class VetoSafety
{
    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>
    /// Tests every (site, channel) that has triggers against the performed injections of the same site (scheduled and
    /// aborted ones are ignored). The rate R is measured away from the injections: triggers inside any injection window are
    /// left out, and so is the time those windows cover. When injections differ in duration each has its own q_i and K
    /// follows the Poisson-binomial distribution. Also reports the deadtime a veto on the channel would cost.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">When an option is out of range (message names it).</exception>
    public static VetoSafetyReport Evaluate(IReadOnlyList<AuxiliaryTrigger> triggers, IReadOnlyList<InjectionRecord> injections, VetoSafetyOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(triggers);
        ArgumentNullException.ThrowIfNull(injections);
        options ??= new VetoSafetyOptions();
        Validate(options);
        var w = options.WindowSeconds;
        var vetoWindow = options.VetoWindowSeconds ?? w;
        var results = new List<ChannelSafety>();
        foreach (var siteGroup in triggers.GroupBy(t => t.Site).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var origin = siteGroup.Min(t => t.Time);
            var spanEnd = siteGroup.Max(t => t.Time).SecondsSince(origin);
            var performed = injections.Where(i => i.Site == siteGroup.Key && i.Status == InjectionStatus.Performed).ToList();
            var windows = performed.Select(i => (From: i.Start.SecondsSince(origin) - w, To: i.End.SecondsSince(origin) + w)).ToList();
            var liveTime = options.LiveTimeSeconds ?? spanEnd;
            var covered = options.LiveTimeSeconds is null
                ? IntervalUnion.Length(windows.Select(x => (Math.Max(x.From, 0), Math.Min(x.To, spanEnd))))
                : IntervalUnion.Length(windows);
            var site = new SiteContext(siteGroup.Key, origin, performed, windows, liveTime, liveTime - covered);
            foreach (var channel in siteGroup.GroupBy(t => t.Channel).OrderBy(g => g.Key, StringComparer.Ordinal))
            {
                var times = channel.Select(t => t.Time.SecondsSince(origin)).Order().ToArray();
                results.Add(Channel(site, channel.Key, times, w, vetoWindow, options.ProbabilityThreshold));
            }
        }

        return new VetoSafetyReport(results, w, options.ProbabilityThreshold, vetoWindow, Overall(results, options.ProbabilityThreshold), Assumptions(options, vetoWindow));
    }

    /// <summary>
    /// Chance that a Poisson stream of rate <paramref name="rateHz"/> puts at least one trigger in an injection's window of
    /// 2 w + d: q = 1 - exp(-R (2 w + d)), computed with expm1 so small values keep their digits.
    /// </summary>
    /// <param name="rateHz">Channel trigger rate R, Hz (&gt;= 0).</param>
    /// <param name="windowSeconds">Half window w, s (&gt;= 0).</param>
    /// <param name="durationSeconds">Injection duration d, s (&gt;= 0).</param>
    public static double ChanceProbability(double rateHz, double windowSeconds, double durationSeconds) =>
        -ExpMinusOne.Of(-rateHz * ((2 * windowSeconds) + durationSeconds));

    private static ChannelSafety Channel(SiteContext site, string channel, double[] times, double w, double vetoWindow, double threshold)
    {
        var coincident = site.Windows.Count(x => AnyWithin(times, x.From, x.To));
        var rateTriggers = times.Count(t => !site.Windows.Any(x => t >= x.From && t <= x.To));
        var deadtime = IntervalUnion.Length(times.Select(t => (t - vetoWindow, t + vetoWindow)));
        var deadFraction = site.LiveTime > 0 ? deadtime / site.LiveTime : double.NaN;
        if (!(site.LiveTime > 0) || !(site.Exposure > 0))
        {
            const string why = "rate unknown: the site's triggers span no time outside the injection windows; give the live time";
            return new ChannelSafety(site.Code, channel, site.Performed.Count, coincident, 0, 0, 1, null, 0, rateTriggers, Math.Max(site.Exposure, 0),
                deadtime, deadFraction, new Judgement(Verdict.NotRun, $"{ChannelName.Qualified(site.Code, channel)} not tested: {why}"), why);
        }

        var rate = rateTriggers / site.Exposure;
        if (site.Performed.Count == 0)
        {
            const string why = "no performed injection at this site";
            return new ChannelSafety(site.Code, channel, 0, 0, 0, 0, 1, null, rate, rateTriggers, site.Exposure, deadtime, deadFraction,
                new Judgement(Verdict.NotRun, $"{ChannelName.Qualified(site.Code, channel)} not tested: {why}"), why);
        }

        var q = site.Performed.Select(i => ChanceProbability(rate, w, i.DurationSeconds)).ToArray();
        var sameQ = q.All(x => Math.Abs(x - q[0]) <= 1e-12 * Math.Max(q[0], 1e-300));
        var probability = sameQ ? Binomial.AtLeast(coincident, q.Length, q[0]) : Binomial.AtLeast(coincident, q);
        var expected = q.Sum();
        var safe = probability >= threshold;
        var numbers = string.Create(Inv,
            $"{coincident} of {q.Length} injections coincident, {expected:0.###} expected by chance (q = {q.Average():0.####} per injection, R = {rate:0.####} Hz away from the injections); P(K ≥ {coincident}) = {ScientificFormat.Format(probability, 4)}");
        var judgement = safe
            ? new Judgement(Verdict.VetoSafe, $"{ChannelName.Qualified(site.Code, channel)} safe: {numbers} ≥ {ScientificFormat.Format(threshold, 3)}")
            : new Judgement(Verdict.VetoUnsafe, $"{ChannelName.Qualified(site.Code, channel)} unsafe, it responds to injections and must not veto: {numbers} < {ScientificFormat.Format(threshold, 3)}");
        return new ChannelSafety(site.Code, channel, q.Length, coincident, expected, q.Average(), probability, safe, rate, rateTriggers, site.Exposure,
            deadtime, deadFraction, judgement, sameQ ? null : "injection durations differ: Poisson-binomial over each injection's own q");
    }

    private static Judgement Overall(List<ChannelSafety> channels, double threshold)
    {
        var unsafeOnes = channels.Where(c => c.Safe == false).ToList();
        var tested = channels.Count(c => c.Safe is not null);
        if (unsafeOnes.Count > 0)
        {
            return new Judgement(Verdict.VetoUnsafe, string.Create(Inv,
                $"{unsafeOnes.Count} of {tested} tested channels respond to injections (binomial P < {ScientificFormat.Format(threshold, 3)}) and must not be used to veto: {string.Join(", ", unsafeOnes.Select(c => ChannelName.Qualified(c.Site, c.Channel)))}"));
        }

        return tested > 0
            ? new Judgement(Verdict.VetoSafe, string.Create(Inv, $"none of {tested} tested channels responds to injections (every binomial P ≥ {ScientificFormat.Format(threshold, 3)})"))
            : new Judgement(Verdict.NotRun, "no channel could be tested (no performed injection, or no rate)");
    }

    private static List<string> Assumptions(VetoSafetyOptions o, double vetoWindow) =>
    [
        "only injections with status 'performed' at the channel's own site are used; each is one trial",
        string.Create(Inv, $"an injection is coincident when a trigger of the channel lies within {o.WindowSeconds} s of its span"),
        o.LiveTimeSeconds is { } l
            ? string.Create(Inv, $"channel rate R = triggers outside every injection window / ({l} s of live time - the time the windows cover)")
            : "channel rate R = triggers outside every injection window / (span from the site's first to last trigger - the time the windows cover); no live-time segments given",
        "chance per injection q = 1 - exp(-R (2 w + d)), the channel a Poisson stream independent of the injections",
        "coincident count K ~ Binomial(n, q) (Poisson-binomial when durations differ); the old Poisson count of triggers is not used, as it lets a channel that fires at every injection pass",
        string.Create(Inv, $"unsafe when P(K >= coincident) < {o.ProbabilityThreshold} (common-practice threshold)"),
        string.Create(Inv, $"deadtime: the union of ±{vetoWindow} s around every trigger of the channel, as a fraction of the live time"),
    ];

    private static void Validate(VetoSafetyOptions options)
    {
        if (!double.IsFinite(options.WindowSeconds) || options.WindowSeconds <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(options), options.WindowSeconds, "WindowSeconds must be finite and > 0.");
        }

        if (!(options.ProbabilityThreshold is > 0 and < 1))
        {
            throw new ArgumentOutOfRangeException(nameof(options), options.ProbabilityThreshold, "ProbabilityThreshold must be in (0, 1).");
        }

        if (options.LiveTimeSeconds is { } lt && (!double.IsFinite(lt) || lt <= 0))
        {
            throw new ArgumentOutOfRangeException(nameof(options), lt, "LiveTimeSeconds must be finite and > 0 when given.");
        }

        if (options.VetoWindowSeconds is { } vw && (!double.IsFinite(vw) || vw <= 0))
        {
            throw new ArgumentOutOfRangeException(nameof(options), vw, "VetoWindowSeconds must be finite and > 0 when given.");
        }
    }

    private static bool AnyWithin(double[] sortedTimes, double from, double to)
    {
        var i = Array.BinarySearch(sortedTimes, from);
        if (i < 0)
        {
            i = ~i;
        }

        return i < sortedTimes.Length && sortedTimes[i] <= to;
    }

    private sealed record SiteContext(string Code, GpsTime Origin, List<InjectionRecord> Performed, List<(double From, double To)> Windows, double LiveTime, double Exposure);
}
