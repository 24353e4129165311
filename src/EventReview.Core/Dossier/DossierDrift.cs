using EventReview.Core.Configuration;

namespace EventReview.Core.Dossier;

/// <summary>
/// Drift of a later snapshot against the frozen snapshot <paramref name="FrozenSnapshotId"/> (see <see cref="DriftCheck"/>):
/// verdict "no drift", "drift" or "concern", whether it was captured during the freeze period, and the key diff.
/// </summary>
public sealed record DossierDrift(
    long FrozenSnapshotId,
    string Verdict,
    string Summary,
    bool CapturedDuringFreeze,
    IReadOnlyList<ConfigurationEntry> Added,
    IReadOnlyList<ConfigurationEntry> Removed,
    IReadOnlyList<ConfigurationChange> Changed,
    int Unchanged);
