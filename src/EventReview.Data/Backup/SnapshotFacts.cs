using EventReview.Core.Evidence;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Backup;

/// <summary>Counts and the set of attachments referenced by evidence rows, read from one database (a snapshot copy or a live server).</summary>
internal sealed record SnapshotFacts(int Cases, int TimelineEntries, int EvidenceItems, IReadOnlySet<string> ReferencedAttachments)
{
    public static async Task<SnapshotFacts> ReadAsync(AppDbContextFactory factory, CancellationToken ct)
    {
        await using var db = factory.CreateDbContext();
        var cases = await db.Cases.CountAsync(ct);
        var entries = await db.Timeline.CountAsync(ct);
        var evidence = await db.Evidence.CountAsync(ct);
        var referenced = await db.Evidence.Where(e => e.Kind == EvidenceKind.Attachment).Select(e => e.ContentSha256).Distinct().ToListAsync(ct);
        return new SnapshotFacts(cases, entries, evidence, referenced.ToHashSet(StringComparer.Ordinal));
    }
}
