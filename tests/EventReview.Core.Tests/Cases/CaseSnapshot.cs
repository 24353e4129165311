using EventReview.Core.Cases;

namespace EventReview.Core.Tests.Cases;

/// <summary>Everything observable about a case, as a value, to show that a refused change changed nothing.</summary>
public sealed record CaseSnapshot(CaseState State, CaseOutcome? Outcome, int Version, DateTimeOffset UpdatedAt, int TimelineCount, string LastHash, string Items)
{
    public static CaseSnapshot Of(ReviewCase c) => new(
        c.State,
        c.Outcome,
        c.Version,
        c.UpdatedAt,
        c.Timeline.Count,
        c.Timeline[^1].Hash,
        string.Join(";", c.Items.Select(i =>
            $"{i.Key}:{i.State}:v{i.Version}:{i.Fingerprint()}:{i.Evidence.Count}:{i.Computations.Count}:{i.SignOffs.Count}:{i.SignOffs.Count(s => s.IsStale)}:{i.OwnerId}:{i.DueDate}")));
}
