using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests;

/// <summary>Group commit (<see cref="Writes.BatchingWriteGate"/>) on both providers under many parallel writers.</summary>
public abstract partial class DataStoreTests
{
    [Fact]
    public async Task Many_parallel_appends_on_a_few_cases_lose_and_reorder_nothing_and_verify()
    {
        const int Cases = 3, Writers = 24, Each = 10;
        var ids = new List<int>();
        for (var i = 0; i < Cases; i++)
        {
            ids.Add(await SaveNewAsync(SampleCases.Open(NewCandidateId())));
        }

        // Two writers, as two app instances on one database have: on PostgreSQL their batches meet at the case's row lock.
        var gates = new[] { NewGate(), NewGate() };
        try
        {
            var start = SampleCases.T0.AddHours(5);
            await Task.WhenAll(Enumerable.Range(0, Writers).Select(w => Task.Run(async () =>
            {
                // Each writer waits for each answer before its next append, so its own notes must appear in its order.
                for (var n = 0; n < Each; n++)
                {
                    // Normalised as the app does before an append (EvidenceAppender), so the case's last-change time is the entry's.
                    var at = EventReview.Core.Time.RecordedTime.Normalize(start.AddMilliseconds((w * Each) + n));
                    Assert.NotNull(await AppendAsync(gates[w % 2], ids[w % Cases], n % 2 == 0 ? "alpha.one" : "beta.one",
                        t => EvidenceItem.Note($"w{w:D2} n{n:D2}", SampleCases.ReviewerA, t), SampleCases.ReviewerA, at));
                }
            })));
        }
        finally
        {
            await DisposeGateAsync(gates[0]);
            await DisposeGateAsync(gates[1]);
        }

        var verifier = new IntegrityVerifier(Factory, new AttachmentStore(Factory.Settings), Factory.Settings, Factory.Records);
        for (var i = 0; i < Cases; i++)
        {
            var c = await LoadAsync(ids[i]);
            var writers = Enumerable.Range(0, Writers).Where(w => w % Cases == i).ToList();
            var notes = c.Items.SelectMany(item => item.Evidence).OrderBy(e => e.Id).Select(e => e.Text).ToList();

            // Nothing lost: every acknowledged note is stored, once, and the timeline has one entry per append.
            Assert.Equal(writers.Count * Each, notes.Count);
            Assert.Equal(1 + (writers.Count * Each), c.Timeline.Count);
            Assert.Equal(Enumerable.Range(1, 1 + (writers.Count * Each)), c.Timeline.Select(a => a.Sequence).Order());
            Assert.Null(TimelineChain.FirstProblem(c.Timeline.OrderBy(a => a.Sequence)));

            // Nothing reordered: each writer's notes come in the order it was answered.
            foreach (var w in writers)
            {
                var own = notes.Where(t => t.StartsWith($"w{w:D2} ", StringComparison.Ordinal)).ToList();
                Assert.Equal(Enumerable.Range(0, Each).Select(n => $"w{w:D2} n{n:D2}"), own);
            }

            var (results, _) = await verifier.VerifyAsync(ids[i]);
            Assert.True(Assert.Single(results).Valid, string.Join("; ", results.SelectMany(r => r.Problems).Select(p => p.What)));
        }
    }
}
