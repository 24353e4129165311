using System.Collections.Concurrent;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Data.Tests.Fixtures;
using EventReview.Data.Writes;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests;

/// <summary>
/// The writer's remembered chain heads (<see cref="BatchingWriteGate"/> on PostgreSQL): appends without reading the case
/// must store exactly what the one-at-a-time path (the loaded case) stores, also when another writer or another kind of
/// save changed the case in between, and under many writers the order of each case is the order of the answers.
/// </summary>
public abstract partial class DataStoreTests
{
    [Fact]
    public async Task Appends_from_a_remembered_head_store_what_the_loaded_case_would_also_after_changes_by_another_writer_and_path()
    {
        var id = await SaveNewAsync(SampleCases.Open(NewCandidateId()));
        var expected = await LoadAsync(id); // the oracle: the same changes applied one at a time to the loaded case
        var t = SampleCases.T0.AddHours(6);
        DateTimeOffset Next() => t = EventReview.Core.Time.RecordedTime.Normalize(t.AddMilliseconds(3));
        var (a, b) = (new BatchingWriteGate(Factory), new BatchingWriteGate(Factory)); // two writers, as two app instances have
        var receipts = new List<(string Key, string Fingerprint)>();
        var expectedFingerprints = new List<(string Key, string Fingerprint)>();

        async Task Note(BatchingWriteGate gate, string key, string text)
        {
            var at = Next();
            var stored = await AppendAsync(gate, id, key, now => EvidenceItem.Note(text, SampleCases.ReviewerA, now), SampleCases.ReviewerA, at);
            Assert.NotNull(stored);
            receipts.Add((key, stored.ItemFingerprint));
            expected.AddEvidence(key, EvidenceItem.Note(text, SampleCases.ReviewerA, at), SampleCases.ReviewerA, at);
            expectedFingerprints.Add((key, expected.Item(key).Fingerprint()));
        }

        try
        {
            await Note(a, "alpha.one", "First.");  // read, then remembered
            await Note(a, "alpha.one", "Second."); // from the remembered head
            await Note(a, "beta.one", "Third.");   // another item of the case: read
            await Note(a, "beta.one", "Fourth.");
            await Note(b, "alpha.one", "Fifth, by the other writer."); // a's head is now out of date
            await Note(a, "alpha.one", "Sixth.");  // the database refuses the old head; a reads the case again

            // A change through the other path (a loaded case saved by the same writer): the writer forgets the case.
            var assignedAt = Next();
            await a.RunAsync(async (db, ct) =>
            {
                var c = await db.CasesWithEverything().SingleAsync(x => x.Id == id, ct);
                c.AssignItem("beta.one", "owner-1", "Owner One", SampleCases.Coordinator, assignedAt);
                await db.SaveChangesAsync(ct);
                return 0;
            });
            expected.AssignItem("beta.one", "owner-1", "Owner One", SampleCases.Coordinator, assignedAt);
            await Note(a, "beta.one", "Seventh.");
            await Note(a, "beta.one", "Eighth.");
        }
        finally
        {
            await a.DisposeAsync();
            await b.DisposeAsync();
        }

        if (Factory.Settings.Provider == DatabaseProvider.Postgres)
        {
            Assert.True(a.AppendsFromRememberedHead >= 3, $"only {a.AppendsFromRememberedHead} appends used the remembered head");
            Assert.True(a.StaleRememberedHeads >= 1, "the other writer's append was not noticed");
        }

        var actual = await LoadAsync(id);
        foreach (var entry in expected.Timeline.Where(x => x.KeyId is null))
        {
            Factory.Records!.Sign(entry);
        }

        // Same rows: every timeline entry (facts, hashes, key, MAC), case and item states, versions and fingerprints.
        Assert.Equal(expected.Timeline.Select(x => (x.Sequence, x.Kind, x.ItemKey, x.Text, x.At, x.PreviousHash, x.Hash, x.Facts, x.KeyId, x.Mac)),
            actual.Timeline.OrderBy(x => x.Sequence).Select(x => (x.Sequence, x.Kind, x.ItemKey, x.Text, x.At, x.PreviousHash, x.Hash, x.Facts, x.KeyId, x.Mac)));
        Assert.Equal((expected.State, expected.Version, expected.UpdatedAt), (actual.State, actual.Version, actual.UpdatedAt));
        Assert.Equal(expected.Items.Select(i => (i.Key, i.State, i.Version, i.OwnerId, i.Fingerprint())), actual.Items.Select(i => (i.Key, i.State, i.Version, i.OwnerId, i.Fingerprint())));
        Assert.Equal(expected.Items.SelectMany(i => i.Evidence).Select(e => e.Seal()).Order(), actual.Items.SelectMany(i => i.Evidence).Select(e => e.Seal()).Order());
        Assert.Equal(expectedFingerprints, receipts); // each answer's fingerprint is the item's as the loaded case had it then
        Assert.Empty(CaseIntegrity.Verify(actual, _ => true, Factory.Records!.Keys));
    }

    [Fact]
    public async Task Many_writers_on_several_cases_through_two_writers_keep_each_case_in_the_order_of_the_answers()
    {
        const int Cases = 4, Writers = 32, Each = 8;
        var ids = new List<int>();
        for (var i = 0; i < Cases; i++)
        {
            ids.Add(await SaveNewAsync(SampleCases.Open(NewCandidateId())));
        }

        // A global clock of events: when each append was handed over and when it was answered.
        var clock = 0L;
        var appends = new ConcurrentBag<(int Case, string Text, long Sent, long Answered)>();
        var gates = new[] { new BatchingWriteGate(Factory), new BatchingWriteGate(Factory) };
        try
        {
            var start = SampleCases.T0.AddHours(7);
            await Task.WhenAll(Enumerable.Range(0, Writers).Select(w => Task.Run(async () =>
            {
                for (var n = 0; n < Each; n++)
                {
                    var text = $"w{w:D2} n{n:D2}";
                    var caseId = ids[(w + n) % Cases]; // each writer moves between cases
                    var at = EventReview.Core.Time.RecordedTime.Normalize(start.AddMilliseconds((w * Each) + n));
                    var sent = Interlocked.Increment(ref clock);
                    Assert.NotNull(await AppendAsync(gates[w % 2], caseId, n % 3 == 0 ? "alpha.one" : "beta.one",
                        t => EvidenceItem.Note(text, SampleCases.ReviewerA, t), SampleCases.ReviewerA, at));
                    appends.Add((caseId, text, sent, Interlocked.Increment(ref clock)));
                }
            })));
        }
        finally
        {
            await gates[0].DisposeAsync();
            await gates[1].DisposeAsync();
        }

        var verifier = new IntegrityVerifier(Factory, new AttachmentStore(Factory.Settings), Factory.Settings, Factory.Records);
        foreach (var id in ids)
        {
            var c = await LoadAsync(id);
            var mine = appends.Where(x => x.Case == id).ToList();

            // Nothing lost: every answered append is stored once, with one timeline entry each, in one unbroken chain.
            var evidence = c.Items.SelectMany(i => i.Evidence).ToList();
            Assert.Equal(mine.Select(x => x.Text).Order(), evidence.Select(e => e.Text).Order());
            Assert.Equal(Enumerable.Range(1, 1 + mine.Count), c.Timeline.Select(x => x.Sequence).Order());
            Assert.Null(TimelineChain.FirstProblem(c.Timeline.OrderBy(x => x.Sequence)));

            // Nothing reordered: an append answered before another was handed over comes first in the timeline.
            var sequenceOf = evidence.ToDictionary(e => e.Text, e => c.Timeline.Single(x => x.Text.Contains(e.ContentSha256, StringComparison.Ordinal)).Sequence);
            foreach (var first in mine)
            {
                foreach (var later in mine.Where(x => x.Sent > first.Answered))
                {
                    Assert.True(sequenceOf[first.Text] < sequenceOf[later.Text], $"{later.Text} was handed over after {first.Text} was answered but stands before it");
                }
            }

            var (results, _) = await verifier.VerifyAsync(id);
            Assert.True(Assert.Single(results).Valid, string.Join("; ", results.SelectMany(r => r.Problems).Select(p => p.What)));
        }

        if (Factory.Settings.Provider == DatabaseProvider.Postgres)
        {
            Assert.True(gates.Sum(g => g.AppendsFromRememberedHead) > 0, "no append used a remembered head");
        }
    }
}
