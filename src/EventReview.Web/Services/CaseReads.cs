using EventReview.Core.Cases;
using EventReview.Core.Evidence;

namespace EventReview.Web.Services;

/// <summary>One page of the case list: the cases on it (with items and sign-offs, not evidence) and how many match in all.</summary>
public sealed record CaseListPage(int Total, int Offset, int Limit, IReadOnlyList<ReviewCase> Cases);

/// <summary>
/// A case for display without its evidence bodies and timeline: items and sign-offs, plus each item's evidence count
/// and fingerprint computed from the evidence hashes alone, so reading it stays cheap however much evidence there is.
/// </summary>
public sealed record CaseOverview(ReviewCase Case, IReadOnlyDictionary<string, ItemEvidenceSummary> Items);

/// <summary>How much evidence (notes, files, links and computation records) an item holds, and its fingerprint.</summary>
public sealed record ItemEvidenceSummary(int EvidenceCount, int ComputationCount, string Fingerprint);

/// <summary>One page of an item's evidence, oldest first.</summary>
public sealed record EvidencePage(int Total, int Offset, int Limit, IReadOnlyList<EvidenceItem> Evidence);

/// <summary>One page of a case's timeline, newest first.</summary>
public sealed record TimelinePage(int Total, int Offset, int Limit, IReadOnlyList<TimelineEntry> Entries);

/// <summary>Limits of paged reads.</summary>
public static class Paging
{
    public const int DefaultLimit = 50;

    public const int MaxLimit = 500;

    /// <summary>Checks offset and limit (limit null: the default).</summary>
    /// <exception cref="ArgumentOutOfRangeException">When offset is negative or limit is outside 1..500.</exception>
    public static (int Offset, int Limit) Check(int? offset, int? limit)
    {
        var o = offset ?? 0;
        var l = limit ?? DefaultLimit;
        if (o < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(offset), o, "offset must be 0 or more.");
        }

        if (l is < 1 or > MaxLimit)
        {
            throw new ArgumentOutOfRangeException(nameof(limit), l, $"limit must be between 1 and {MaxLimit}.");
        }

        return (o, l);
    }
}
