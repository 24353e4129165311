using System.Collections.Concurrent;
using EventReview.Core.Evidence;
using EventReview.Core.Records;
using EventReview.Data.Records;
using EventReview.Data.Tests.Fixtures;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests;

/// <summary>
/// The commit observers (<see cref="RecordKeeping.ObserveCommits"/>, which feed the live case pages) hear every committed
/// write with its case chain's head, from every writer, and never a write that was rolled back.
/// </summary>
public abstract partial class DataStoreTests
{
    [Fact]
    public async Task Commit_observers_hear_committed_writes_and_never_a_rolled_back_one()
    {
        var heard = new ConcurrentQueue<WitnessedHead>();
        using var observing = Factory.Records!.ObserveCommits(heads =>
        {
            foreach (var h in heads)
            {
                heard.Enqueue(h);
            }
        });
        var candidate = NewCandidateId();
        var chain = EntryMac.CaseChain(candidate);

        // A plain save outside the gate (the interceptor's path): the opening entry, sequence 1.
        var id = await SaveNewAsync(SampleCases.Open(candidate));
        Assert.Contains(new WitnessedHead(chain, 1, (await LoadAsync(id)).Timeline.Single().Hash), heard);

        var gate = NewGate();
        try
        {
            // A unit that stores a note and then fails is rolled back: nothing is heard of it.
            var fails = gate.RunAsync<int>(async (db, ct) =>
            {
                var c = await db.CasesWithEverything().SingleAsync(x => x.Id == id, ct);
                c.AddEvidence("alpha.one", EvidenceItem.Note("Never stored.", SampleCases.ReviewerA, SampleCases.T0.AddHours(1)), SampleCases.ReviewerA, SampleCases.T0.AddHours(1));
                await db.SaveChangesAsync(ct);
                throw new InvalidOperationException("fails after its save");
            });
            await Assert.ThrowsAsync<InvalidOperationException>(() => fails);

            // The short path (hand-written SQL) and a gate save both are heard, after their commit, with the new head.
            Assert.NotNull(await AppendAsync(gate, id, "alpha.one", t => EvidenceItem.Note("Stored.", SampleCases.ReviewerA, t), SampleCases.ReviewerA, SampleCases.T0.AddHours(2)));
            await using (var db = Factory.CreateDbContext())
            {
                var c = await db.CasesWithEverything().SingleAsync(x => x.Id == id);
                c.StartItem("beta.one", SampleCases.ReviewerB, SampleCases.T0.AddHours(3));
                await gate.SaveAsync(db);
            }
        }
        finally
        {
            await DisposeGateAsync(gate);
        }

        var stored = await LoadAsync(id);
        Assert.Equal([1, 2, 3], stored.Timeline.Select(a => a.Sequence).Order());
        var ofCase = heard.Where(h => h.Chain == chain).ToList();
        Assert.Equal([1, 2, 3], ofCase.Select(h => h.Sequence));
        Assert.Equal(stored.Timeline.OrderBy(a => a.Sequence).Select(a => a.Hash), ofCase.Select(h => h.Hash));
    }
}
