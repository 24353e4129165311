using System.Globalization;

namespace EventReview.Core.Configuration;

/// <summary>
/// Drift of a later snapshot from a frozen one: the key diff plus whether the later snapshot was captured inside the
/// freeze period. Any change captured during the freeze period is a concern; a change captured outside it is drift to note.
/// </summary>
public static class DriftCheck
{
    /// <summary>Verdict when nothing changed.</summary>
    public const string NoDrift = "no drift";

    /// <summary>Verdict when something changed outside the freeze period.</summary>
    public const string Drift = "drift";

    /// <summary>Verdict when something changed inside the freeze period.</summary>
    public const string Concern = "concern";

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
        IReadOnlyDictionary<string, string> laterItems, DateTimeOffset laterCapturedAt)
    {
        var diff = ConfigurationDiff.Compare(frozenItems, laterItems);
        var during = laterCapturedAt >= freezeFrom && laterCapturedAt <= freezeUntil;
        var verdict = !diff.HasDrift ? NoDrift : during ? Concern : Drift;
        var counts = string.Create(CultureInfo.InvariantCulture, $"{diff.Added.Count} added, {diff.Removed.Count} removed, {diff.Changed.Count} changed, {diff.Unchanged} unchanged");
        var when = during ? "during the freeze period" : "outside the freeze period";
        var summary = verdict switch
        {
            NoDrift => $"{siteCode}: no change from the frozen configuration ({counts}); captured {when}.",
            Drift => $"{siteCode}: changed from the frozen configuration ({counts}); captured {when}.",
            _ => $"{siteCode}: CONCERN: the configuration changed during the freeze period ({counts}).",
        };
        return new DriftReport(siteCode, laterCapturedAt, during, diff, verdict, summary);
    }
}
