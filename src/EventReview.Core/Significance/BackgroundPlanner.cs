using System.Globalization;
using EventReview.Core.Geodesy;
using EventReview.Core.Network;

namespace EventReview.Core.Significance;

/// <summary>
/// Plans a background check: per pair of sites its window (given, or the pair's light-travel time plus a timing tolerance)
/// and the candidate's statistic (given, from the arrivals' SNRs, or from the zero-lag coincidence); for three sites the
/// triple's windows and statistic.
/// </summary>
public static class BackgroundPlanner
{
    /// <summary>The step must be at least this many times the window ("much longer"; common practice).</summary>
    public const double MinStepOverWindow = 10.0;

    private static readonly CultureInfo Inv = CultureInfo.InvariantCulture;

    /// <summary>Every pair of <paramref name="codes"/> (sorted), first by code fixed and second sliding.</summary>
    /// <param name="codes">Site codes (two or more).</param>
    /// <param name="findSite">The network's site for a code, or null when it is not in the network.</param>
    /// <param name="windowMs">Window for every pair, ms; null derives it per pair.</param>
    /// <param name="toleranceMs">Timing tolerance added to the light-travel time, ms.</param>
    /// <param name="snrOf">The candidate's SNR at a site, or null when unknown.</param>
    /// <param name="candidateStatistic">Statistic for every pair; null uses the SNRs, else the zero-lag coincidence.</param>
    /// <exception cref="ArgumentException">When a window cannot be derived (a site not in the network and no window given).</exception>
    public static IReadOnlyList<BackgroundPairPlan> Pairs(IReadOnlyList<string> codes, Func<string, Site?> findSite, double? windowMs, double toleranceMs,
        Func<string, double?> snrOf, double? candidateStatistic)
    {
        ArgumentNullException.ThrowIfNull(codes);
        ArgumentNullException.ThrowIfNull(findSite);
        ArgumentNullException.ThrowIfNull(snrOf);
        var sorted = codes.Select(s => s.Trim().ToUpperInvariant()).Distinct().OrderBy(s => s, StringComparer.Ordinal).ToList();
        var plans = new List<BackgroundPairPlan>();
        for (var i = 0; i < sorted.Count; i++)
        {
            for (var j = i + 1; j < sorted.Count; j++)
            {
                var (a, b) = (sorted[i], sorted[j]);
                var sa = findSite(a);
                var sb = findSite(b);
                double? lightMs = sa is not null && sb is not null ? Baseline.Between(sa, sb).LightTravelSeconds * 1e3 : null;
                double window;
                string windowRule;
                if (windowMs is { } w)
                {
                    window = w;
                    windowRule = lightMs is { } l ? string.Create(Inv, $"given (light-travel {l:F1} ms)") : "given";
                }
                else
                {
                    var l = lightMs ?? throw new ArgumentException($"Site {(sa is null ? a : b)} is not in the network, so the light-travel window cannot be derived; give the window in ms.", "WindowMs");
                    window = Math.Round(l + toleranceMs, 3);
                    windowRule = string.Create(Inv, $"light-travel {l:F1} ms + tolerance {toleranceMs:0.###} ms");
                }

                var (stat, statRule) = Statistic(candidateStatistic, [a, b], snrOf);
                plans.Add(new BackgroundPairPlan(a, b, lightMs is { } lm ? Math.Round(lm, 4) : null, window, windowRule, stat, statRule));
            }
        }

        return plans;
    }

    /// <summary>The triple's statistic: given, sqrt of the sum of the three squared SNRs, or null (the zero-lag triple).</summary>
    public static (double? Value, string Rule) Statistic(double? given, IReadOnlyList<string> codes, Func<string, double?> snrOf)
    {
        ArgumentNullException.ThrowIfNull(codes);
        ArgumentNullException.ThrowIfNull(snrOf);
        if (given is { } g)
        {
            return (g, "given");
        }

        var snrs = codes.Select(snrOf).ToList();
        if (snrs.All(s => s is not null))
        {
            return (Math.Round(Math.Sqrt(snrs.Sum(s => s!.Value * s.Value)), 3),
                "√(" + string.Join(" + ", snrs.Select(s => string.Create(Inv, $"{s:0.##}²"))) + ") from the case's arrivals");
        }

        return (null, "the zero-lag coincidence nearest the candidate time");
    }

    /// <summary>Refuses a step that is not much longer than the window.</summary>
    /// <exception cref="ArgumentException">Naming both values and the rule.</exception>
    public static void RequireStepMuchLongerThanWindow(double stepSeconds, double windowMs, string pair)
    {
        if (stepSeconds * 1e3 < MinStepOverWindow * windowMs)
        {
            throw new ArgumentException(string.Create(Inv,
                $"The slide step ({stepSeconds:G6} s) must be much longer than the coincidence window of {pair} (±{windowMs:F1} ms): at least {MinStepOverWindow:0} × the window ({MinStepOverWindow * windowMs / 1e3:G3} s), so that slides never re-pair the same triggers and stay independent; a few seconds is usual."),
                "StepSeconds");
        }
    }
}
