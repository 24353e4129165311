using EventReview.Core.Injections;
using EventReview.Core.Statistics;

namespace EventReview.Core.Environment;

/// <summary>
/// Veto safety: does a channel respond to hardware injections? A channel that does could also respond to a real
/// signal, so it must not be used to veto. Counts injections coincident with the channel's triggers and compares
/// with the Poisson expectation from the channel's own rate.
/// </summary>
public static class VetoSafety
{
    /// <summary>
    /// Tests every (site, channel) that has triggers against the performed injections of the same site.
    /// Coincident = injections with at least one trigger in [start - w, end + w]; expected = R x sum(2 w + duration)
    /// with R = the channel's triggers / live time; probability = P(N &gt;= coincident | expected) (Poisson);
    /// unsafe when probability &lt; threshold. Scheduled and aborted injections are ignored.
    /// </summary>
    public static VetoSafetyReport Evaluate(IReadOnlyList<AuxiliaryTrigger> triggers, IReadOnlyList<InjectionRecord> injections, VetoSafetyOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(triggers);
        ArgumentNullException.ThrowIfNull(injections);
        options ??= new VetoSafetyOptions();
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

        var w = options.WindowSeconds;
        var results = new List<ChannelSafety>();
        foreach (var siteGroup in triggers.GroupBy(t => t.Site).OrderBy(g => g.Key, StringComparer.Ordinal))
        {
            var performed = injections.Where(i => i.Site == siteGroup.Key && i.Status == InjectionStatus.Performed).ToList();
            var liveTime = options.LiveTimeSeconds ?? SiteSpan(siteGroup);
            foreach (var channel in siteGroup.GroupBy(t => t.Channel).OrderBy(g => g.Key, StringComparer.Ordinal))
            {
                var times = channel.Select(t => t.Time).Order().ToArray();
                var coincident = performed.Count(inj => AnyWithin(times, inj.Start.AddSeconds(-w), inj.End.AddSeconds(w)));
                if (!(liveTime > 0))
                {
                    results.Add(new ChannelSafety(siteGroup.Key, channel.Key, performed.Count, coincident, 0, 1, null, 0,
                        "rate unknown: the site's triggers span no time; give the live time"));
                    continue;
                }

                var rate = times.Length / liveTime;
                var expected = rate * performed.Sum(inj => (2 * w) + inj.DurationSeconds);
                var probability = Poisson.AtLeast(coincident, expected);
                bool? safe = performed.Count == 0 ? null : probability >= options.ProbabilityThreshold;
                var note = performed.Count == 0 ? "no performed injection at this site" : null;
                results.Add(new ChannelSafety(siteGroup.Key, channel.Key, performed.Count, coincident, expected, probability, safe, rate, note));
            }
        }

        var assumptions = new List<string>
        {
            "only injections with status 'performed' at the channel's own site are used",
            $"an injection is coincident when a trigger lies within {w} s of its span",
            options.LiveTimeSeconds is { } l
                ? $"channel rate = triggers / {l} s of live time"
                : "channel rate = triggers / span from the site's first to last trigger in the list (no live-time segments given)",
            "expected count = rate x sum(2 w + duration), the small-rate Poisson form",
            $"unsafe when P(N >= coincident) < {options.ProbabilityThreshold} (common-practice threshold)",
        };
        return new VetoSafetyReport(results, w, options.ProbabilityThreshold, assumptions);
    }

    private static double SiteSpan(IEnumerable<AuxiliaryTrigger> siteTriggers)
    {
        var min = siteTriggers.Min(t => t.Time);
        var max = siteTriggers.Max(t => t.Time);
        return max.SecondsSince(min);
    }

    private static bool AnyWithin(Time.GpsTime[] sortedTimes, Time.GpsTime from, Time.GpsTime to)
    {
        var i = Array.BinarySearch(sortedTimes, from);
        if (i < 0)
        {
            i = ~i;
        }

        return i < sortedTimes.Length && sortedTimes[i] <= to;
    }
}
