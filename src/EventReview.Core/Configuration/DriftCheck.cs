using System.Globalization;
using EventReview.Core.Verdicts;

namespace EventReview.Core.Configuration;

/// <summary>
/// Drift of a later snapshot from a frozen one: the key diff plus whether the later snapshot was captured inside the
/// freeze period. Any change captured during the freeze period is a concern; a change captured outside it is drift to note.
/// </summary>
public static class DriftCheck
{
    /// <summary>Verdict word when nothing changed.</summary>
    public static readonly string NoDrift = VerdictWords.Word(Verdict.NoDrift);

    /// <summary>Verdict word when something changed outside the freeze period.</summary>
    public static readonly string Drift = VerdictWords.Word(Verdict.Drift);

    /// <summary>Verdict word when something changed inside the freeze period.</summary>
    public static readonly string Concern = VerdictWords.Word(Verdict.Concern);

    /// <summary>Checks <paramref name="later"/> against the frozen <paramref name="frozen"/>.</summary>
    /// <exception cref="ArgumentException">When <paramref name="frozen"/> is not frozen or the sites differ.</exception>
    public static DriftReport Run(ConfigurationSnapshot frozen, ConfigurationSnapshot later)
    {
        ArgumentNullException.ThrowIfNull(frozen);
        ArgumentNullException.ThrowIfNull(later);
        if (!frozen.IsFrozen || frozen.FreezeFrom is not { } from || frozen.FreezeUntil is not { } until)
        {
            throw new ArgumentException("The reference snapshot is not frozen.", nameof(frozen));
        }

        if (!string.Equals(frozen.SiteCode, later.SiteCode, StringComparison.Ordinal))
        {
            throw new ArgumentException($"Snapshots of different sites ({frozen.SiteCode} and {later.SiteCode}) cannot be compared.", nameof(later));
        }

        return Run(frozen.SiteCode, frozen.Items, from, until, later.Items, later.CapturedAt);
    }

    /// <summary>The same check from plain values (freeze bounds inclusive).</summary>
    public static DriftReport Run(string siteCode, IReadOnlyDictionary<string, string> frozenItems, DateTimeOffset freezeFrom, DateTimeOffset freezeUntil,
        IReadOnlyDictionary<string, string> laterItems, DateTimeOffset laterCapturedAt) =>
        Judge(siteCode, frozenItems, laterItems, laterCapturedAt, laterCapturedAt >= freezeFrom && laterCapturedAt <= freezeUntil);

    /// <summary>
    /// Two configurations compared without knowing when the later one was captured relative to a freeze period (the CLI's
    /// file comparison): "no drift" or "drift"; a change can only be a concern once it is known to fall inside the freeze.
    /// </summary>
    public static DriftReport Compare(string siteCode, IReadOnlyDictionary<string, string> frozenItems, IReadOnlyDictionary<string, string> laterItems) =>
        Judge(siteCode, frozenItems, laterItems, null, null);

    /// <summary>
    /// The status of a frozen record given the drift of every later snapshot against it: "concern" when any changed during
    /// the freeze period, otherwise "frozen".
    /// </summary>
    public static Judgement FreezeStatus(IEnumerable<DriftReport> drifts)
    {
        ArgumentNullException.ThrowIfNull(drifts);
        var concerns = drifts.Where(d => d.IsConcern).ToList();
        return concerns.Count > 0
            ? new Judgement(Verdict.Concern, string.Join(" ", concerns.Select(d => d.Summary)))
            : new Judgement(Verdict.Frozen, "no snapshot captured during the freeze period differs from the frozen one");
    }

    private static DriftReport Judge(string siteCode, IReadOnlyDictionary<string, string> frozenItems, IReadOnlyDictionary<string, string> laterItems,
        DateTimeOffset? capturedAt, bool? during)
    {
        var diff = ConfigurationDiff.Compare(frozenItems, laterItems);
        var counts = string.Create(CultureInfo.InvariantCulture, $"{diff.Added.Count} added, {diff.Removed.Count} removed, {diff.Changed.Count} changed, {diff.Unchanged} unchanged");
        var when = during switch
        {
            true => "captured during the freeze period",
            false => "captured outside the freeze period",
            null => "freeze period not known",
        };
        var judgement = !diff.HasDrift
            ? new Judgement(Verdict.NoDrift, $"{siteCode}: no change from the frozen configuration ({counts}); {when}.")
            : during == true
                ? new Judgement(Verdict.Concern, $"{siteCode}: CONCERN: the configuration changed during the freeze period ({counts}).")
                : new Judgement(Verdict.Drift, $"{siteCode}: changed from the frozen configuration ({counts}); {when}.");
        return new DriftReport(siteCode, capturedAt, during, diff, judgement);
    }
}
