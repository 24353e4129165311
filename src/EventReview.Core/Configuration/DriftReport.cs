namespace EventReview.Core.Configuration;

/// <summary>
/// A later snapshot checked against the frozen one. <see cref="CapturedDuringFreeze"/> is true when the later snapshot
/// was captured inside the freeze period (bounds inclusive). <see cref="Verdict"/> is "no drift", "drift" (changes,
/// captured outside the freeze period: a note) or "concern" (changes captured during the freeze period).
/// </summary>
public sealed record DriftReport(
    string SiteCode,
    DateTimeOffset LaterCapturedAt,
    bool CapturedDuringFreeze,
    ConfigurationDiffResult Diff,
    string Verdict,
    string Summary)
{
    /// <summary>True when the verdict is "concern".</summary>
    public bool IsConcern => Verdict == DriftCheck.Concern;
}
