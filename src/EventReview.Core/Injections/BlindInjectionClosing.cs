using EventReview.Core.Cases;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Injections;

/// <summary>
/// The closing rule of sealed blind-injection records. A case may be closed as astrophysical only when every registered
/// sealed record is opened, and no opened record holds a blind injection (performed or scheduled) overlapping the case's
/// arrivals: a candidate that coincides with a blind injection is that injection until shown otherwise. Other outcomes
/// (instrumental, injection, inconclusive) are never held back by sealed records.
/// </summary>
public static class BlindInjectionClosing
{
    /// <summary>Margin around each blind injection's span used when comparing at closing time, seconds.</summary>
    public const double MarginSeconds = 10.0;

    /// <summary>Decides for <paramref name="outcome"/> given the state of every registered seal.</summary>
    public static ClosingDecision Decide(CaseOutcome outcome, IReadOnlyList<SealState> seals)
    {
        ArgumentNullException.ThrowIfNull(seals);
        if (outcome != CaseOutcome.Astrophysical)
        {
            return new ClosingDecision(true, null, new Judgement(Verdict.Clear, $"closing as {outcome.ToString().ToLowerInvariant()} does not depend on sealed blind-injection records"));
        }

        var unopened = seals.Where(s => !s.Opened).Select(s => $"'{s.Label}'").ToList();
        if (unopened.Count > 0)
        {
            return new ClosingDecision(false, "sealed-record-unopened", new Judgement(Verdict.Sealed,
                $"A sealed blind-injection record is not opened yet ({string.Join(", ", unopened)}): a case cannot be closed as astrophysical until it is opened and compared (item injection.blind-open)."));
        }

        var overlapping = seals.Where(s => s.ComparisonWithCase?.Judgement.Verdict == Verdict.Concern).ToList();
        if (overlapping.Count > 0)
        {
            return new ClosingDecision(false, "blind-injection-overlap", new Judgement(Verdict.Concern,
                "The candidate coincides with a blind injection, so it cannot be closed as astrophysical: " +
                string.Join("; ", overlapping.Select(s => $"sealed record '{s.Label}': {s.ComparisonWithCase!.Judgement.Reason}")) + "."));
        }

        return new ClosingDecision(true, null, new Judgement(Verdict.Clear, seals.Count == 0
            ? "no sealed blind-injection record is registered"
            : $"every sealed blind-injection record is opened ({seals.Count}) and none holds an injection overlapping the candidate"));
    }

    /// <summary>The state of one seal against a case: its opened record (if any) looked up at the case's arrivals.</summary>
    /// <param name="label">The seal's label.</param>
    /// <param name="openedRecord">The revealed record bytes, or null when not opened.</param>
    /// <param name="caseTime">The case's GPS time.</param>
    /// <param name="arrivals">The case's arrival per site.</param>
    /// <param name="marginSeconds">Margin around each blind injection's span, s (default <see cref="MarginSeconds"/>).</param>
    public static SealState StateOf(string label, byte[]? openedRecord, GpsTime caseTime, IReadOnlyDictionary<string, GpsTime> arrivals, double marginSeconds = MarginSeconds)
    {
        ArgumentNullException.ThrowIfNull(arrivals);
        if (openedRecord is null)
        {
            return new SealState(label, false, null);
        }

        var report = InjectionOverlap.Find(BlindInjectionRecord.Parse(openedRecord, null), caseTime, arrivals, arrivals.Keys, marginSeconds);
        return new SealState(label, true, report);
    }
}
