using EventReview.Core.Configuration;

namespace EventReview.Core.Dossier;

/// <summary>
/// A configuration snapshot. Frozen ones carry the freeze fields and <paramref name="Fingerprint"/> (recomputable with
/// <see cref="ConfigurationCanonical"/> from the site, label, freeze ticks, reason and items); later, unfrozen ones of a
/// site with a frozen snapshot carry <paramref name="Drift"/> against the newest frozen one of that site.
/// Schema 2 adds <paramref name="FrozenAtUtcTicks"/> and <paramref name="OfThisCase"/> (captured or frozen for this case).
/// </summary>
public sealed record DossierConfiguration(
    long Id,
    string SiteCode,
    string Label,
    string CapturedBy,
    string CapturedByName,
    string CapturedAtUtc,
    long CapturedAtUtcTicks,
    bool IsFrozen,
    string? FrozenBy,
    string? FrozenByName,
    string? FrozenAtUtc,
    string? FreezeFromUtc,
    long? FreezeFromUtcTicks,
    string? FreezeUntilUtc,
    long? FreezeUntilUtcTicks,
    string? FreezeReason,
    string? Fingerprint,
    IReadOnlyList<ConfigurationEntry> Items,
    DossierDrift? Drift,
    long? FrozenAtUtcTicks = null,
    bool OfThisCase = false);
