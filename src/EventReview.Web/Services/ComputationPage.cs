using EventReview.Core.Evidence;

namespace EventReview.Web.Services;

/// <summary>One page of an item's computation records, oldest first; <paramref name="CurrentIds"/> holds the newest record of each kind.</summary>
public sealed record ComputationPage(int Total, int Offset, int Limit, IReadOnlyList<ComputationRecord> Records, IReadOnlySet<int> CurrentIds);
