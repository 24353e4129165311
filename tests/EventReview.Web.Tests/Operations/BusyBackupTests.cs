using System.Net;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Data;
using EventReview.Data.Backup;
using EventReview.Web.Tests.Fixtures;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Tests.Operations;

/// <summary>
/// Backs up the running app's data folder (the seeded demo plus cases being written to) while several writers keep
/// adding notes and attachments through the HTTP API, then restores each backup elsewhere: the restored copy must
/// verify clean, and every restored case's timeline must be a prefix of the live one (a consistent moment, no torn write).
/// </summary>
public sealed class BusyBackupTests(EventReviewFactory app) : IClassFixture<EventReviewFactory>
{
    private const int Writers = 4;
    private const int Backups = 3;

    [Fact]
    public async Task Backups_taken_while_writers_add_evidence_restore_elsewhere_and_verify_as_a_consistent_prefix()
    {
        var coordinator = await app.As(Who.Coordinator);
        HttpClient[] clients = [await app.As(Who.Reviewer), await app.As(Who.ReviewerB), coordinator, await app.As(Who.Token)];
        var caseIds = new List<int>();
        for (var i = 0; i < Writers; i++)
        {
            var opened = await coordinator.OpenCaseAsync(ApiCalls.OpenCaseBody(ApiCalls.NewCandidateId()));
            caseIds.Add((await opened.JsonAsync())["id"]!.GetValue<int>());
        }

        using var stop = new CancellationTokenSource();
        var writes = new int[Writers];
        var writers = Enumerable.Range(0, Writers).Select(w => Task.Run(async () =>
        {
            var random = new Random(1000 + w);
            var n = 0;
            while (!stop.IsCancellationRequested)
            {
                n++;
                using var response = n % 3 == 0
                    ? await clients[w].AttachAsync(caseIds[w], "triage.timing", RandomBytes(random), $"plot-{w}-{n}.bin", "busy test")
                    : await clients[w].AddNoteAsync(caseIds[w], "triage.timing", $"Writer {w} note {n}.");
                Assert.True(response.StatusCode == HttpStatusCode.Created, $"writer {w} write {n}: {(int)response.StatusCode}");
                Interlocked.Increment(ref writes[w]);
            }
        })).ToList();

        var archives = new List<string>();
        var restoredFolders = new List<string>();
        try
        {
            await WaitForWritesAsync(writes, 3, writers);
            for (var b = 0; b < Backups; b++)
            {
                var archive = Path.Combine(Path.GetTempPath(), $"er-busy-{Guid.NewGuid():N}.zip");
                archives.Add(archive);
                var report = await Task.Run(() => BackupWriter.CreateAsync(DatabaseSettings.ForSqlite(app.DataDirectory), archive));
                Assert.True(report.CaseCount >= 3 + Writers, "the demo cases and the writers' cases are in the snapshot");
                await WaitForWritesAsync(writes, writes.Min() + 2, writers);
            }
        }
        finally
        {
            await stop.CancelAsync();
            await Task.WhenAll(writers);
        }

        try
        {
            await using var live = app.Db();
            foreach (var archive in archives)
            {
                var folder = Path.Combine(Path.GetTempPath(), $"er-busy-restored-{Guid.NewGuid():N}");
                restoredFolders.Add(folder);
                var restored = await BackupRestorer.RestoreAsync(archive, DatabaseSettings.ForSqlite(folder),
                    new RestoreOptions(Records: EventReview.Data.Records.RecordSettings.ForDataDirectory(app.DataDirectory)));

                Assert.True(restored.Valid, string.Join("; ", restored.Problems.Select(p => $"{p.Case}: {p.What}")));
                await AssertConsistentPrefixAsync(live, folder, caseIds);
            }
        }
        finally
        {
            SqliteConnection.ClearAllPools();
            archives.ForEach(File.Delete);
            restoredFolders.Where(Directory.Exists).ToList().ForEach(f => Directory.Delete(f, recursive: true));
        }
    }

    /// <summary>Every restored case's timeline equals the start of the live one, and every restored attachment's file is in the restored store.</summary>
    private static async Task AssertConsistentPrefixAsync(AppDbContext live, string folder, IReadOnlyList<int> writerCases)
    {
        var settings = DatabaseSettings.ForSqlite(folder);
        var store = new AttachmentStore(settings);
        await using var db = new AppDbContextFactory(settings).CreateDbContext();
        var restoredCases = await db.CasesWithEverything().AsNoTracking().ToListAsync();
        Assert.All(writerCases, id => Assert.Contains(restoredCases, c => c.Id == id));
        foreach (var restored in restoredCases)
        {
            var liveHashes = await live.Timeline.Where(a => a.ReviewCaseId == restored.Id).OrderBy(a => a.Sequence).Select(a => a.Hash).ToListAsync();
            var restoredHashes = restored.Timeline.OrderBy(a => a.Sequence).Select(a => a.Hash).ToList();
            Assert.Equal(liveHashes.Take(restoredHashes.Count), restoredHashes);
            Assert.Null(TimelineChain.FirstProblem(restored.Timeline));
            foreach (var e in restored.Items.SelectMany(i => i.Evidence).Where(e => e.Kind == EvidenceKind.Attachment))
            {
                Assert.True(store.Verify(e.ContentSha256), $"attachment {e.ContentSha256} of case {restored.CandidateId} is in the restored store");
            }
        }

        Assert.Contains(restoredCases.Where(c => writerCases.Contains(c.Id)).SelectMany(c => c.Items).SelectMany(i => i.Evidence),
            e => e.Kind == EvidenceKind.Attachment);
    }

    private static async Task WaitForWritesAsync(int[] writes, int atLeast, List<Task> writers)
    {
        while (Enumerable.Range(0, writes.Length).Any(i => Volatile.Read(ref writes[i]) < atLeast))
        {
            if (writers.FirstOrDefault(t => t.IsCompleted) is { } ended)
            {
                await ended; // a writer failed: surface its assertion
            }

            await Task.Delay(20);
        }
    }

    private static byte[] RandomBytes(Random random)
    {
        var bytes = new byte[random.Next(512, 4096)];
        random.NextBytes(bytes);
        return bytes;
    }
}
