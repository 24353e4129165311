using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Data.Tests.Fixtures;
using EventReview.Data.Writes;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Tests;

/// <summary>The short append path (<see cref="EvidenceAppendSql"/>) against the domain's own rules, on both providers.</summary>
public abstract partial class DataStoreTests
{
    private IWriteGate NewGate() => new BatchingWriteGate(Factory);

    private static async Task DisposeGateAsync(IWriteGate gate)
    {
        if (gate is IAsyncDisposable d)
        {
            await d.DisposeAsync();
        }
    }

    private async Task<AppendedEvidence?> AppendAsync(IWriteGate gate, int caseId, string key, Func<DateTimeOffset, EvidenceItem> make, Actor by, DateTimeOffset at) =>
        await gate.RunSqlAsync((unit, ct) => EvidenceAppendSql.TryAppendAsync(unit, caseId, key, make, by, at, ct));

    [Theory]
    [InlineData("beta.one")] // has a computation record (its line is part of the fingerprint) and no sign-off
    [InlineData("alpha.two", true)] // fresh case: open item, open case
    [InlineData("beta.one", false, "strain:KP")] // a file with a role: the role is stored and sealed (row seal version 2)
    public async Task The_short_append_stores_exactly_what_the_loaded_case_would(string key, bool fresh = false, string? role = null)
    {
        var id = await SaveNewAsync(fresh ? SampleCases.Open(NewCandidateId()) : SampleCases.Worked(NewCandidateId()));
        var at = SampleCases.T0.AddHours(2).AddTicks(7_654_321);
        var when = EventReview.Core.Time.RecordedTime.Normalize(at);
        EvidenceItem Make(DateTimeOffset t) => EvidenceItem.Attachment("trace.h5", "application/x-hdf5", 4096, Hashing.Sha256Hex("trace"), "A trace", SampleCases.ReviewerB, t,
            role is null ? null : EventReview.Core.Evidence.Roles.FileRole.Parse(role));

        // What the aggregate does with the same change at the same time, applied to a copy that is not saved.
        var expected = await LoadAsync(id);
        expected.AddEvidence(key, Make(when), SampleCases.ReviewerB, when);

        var gate = NewGate();
        AppendedEvidence? stored;
        try
        {
            stored = await AppendAsync(gate, id, key, Make, SampleCases.ReviewerB, when);
        }
        finally
        {
            await DisposeGateAsync(gate);
        }

        Assert.NotNull(stored);
        var actual = await LoadAsync(id);

        // The aggregate's new entry, signed as a save would sign it: facts, hash, key and MAC must all be the same.
        foreach (var entry in expected.Timeline.Where(x => x.KeyId is null))
        {
            Factory.Records!.Sign(entry);
        }

        Assert.Equal(expected.Timeline.Select(a => (a.Sequence, a.Kind, a.ItemKey, a.Text, a.At, a.PreviousHash, a.Hash, a.Facts, a.KeyId, a.Mac)),
            actual.Timeline.OrderBy(a => a.Sequence).Select(a => (a.Sequence, a.Kind, a.ItemKey, a.Text, a.At, a.PreviousHash, a.Hash, a.Facts, a.KeyId, a.Mac)));
        Assert.Empty(CaseIntegrity.Verify(actual, _ => true, Factory.Records!.Keys));
        Assert.Equal((expected.State, expected.Version, expected.UpdatedAt), (actual.State, actual.Version, actual.UpdatedAt));
        var (e, a) = (expected.Item(key), actual.Item(key));
        Assert.Equal((e.State, e.Version, e.Fingerprint()), (a.State, a.Version, a.Fingerprint()));
        Assert.Equal((a.State, a.Fingerprint()), (stored.ItemState, stored.ItemFingerprint));
        var row = Assert.Single(a.Evidence, x => x.Id == stored.EvidenceId);
        Assert.Equal(e.Evidence[^1].Seal(), row.Seal());
        Assert.Equal(role, row.Role);
        Assert.Null(TimelineChain.FirstProblem(actual.Timeline.OrderBy(x => x.Sequence)));
    }

    [Fact]
    public async Task The_short_append_leaves_items_with_current_sign_offs_to_the_loaded_case_and_stores_nothing()
    {
        var id = await SaveNewAsync(SampleCases.Worked(NewCandidateId()));
        var before = await LoadAsync(id);
        var gate = NewGate();
        try
        {
            Assert.Null(await AppendAsync(gate, id, "alpha.two", t => EvidenceItem.Note("More.", SampleCases.ReviewerA, t), SampleCases.ReviewerA, SampleCases.T0.AddHours(1)));
        }
        finally
        {
            await DisposeGateAsync(gate);
        }

        var after = await LoadAsync(id);
        Assert.Equal((before.Version, before.Timeline.Count, before.Item("alpha.two").Evidence.Count), (after.Version, after.Timeline.Count, after.Item("alpha.two").Evidence.Count));
    }

    [Fact]
    public async Task The_short_append_refuses_a_missing_case_a_missing_item_a_closed_case_and_bad_evidence_storing_nothing()
    {
        var c = SampleCases.Open(NewCandidateId());
        var id = await SaveNewAsync(c);
        var gate = NewGate();
        var at = SampleCases.T0.AddHours(1);
        try
        {
            var noCase = await Assert.ThrowsAsync<KeyNotFoundException>(() => AppendAsync(gate, int.MaxValue, "alpha.one", t => EvidenceItem.Note("x", SampleCases.ReviewerA, t), SampleCases.ReviewerA, at));
            Assert.Contains($"no case with id {int.MaxValue}", noCase.Message, StringComparison.Ordinal);
            var noItem = await Assert.ThrowsAsync<KeyNotFoundException>(() => AppendAsync(gate, id, "gamma.nine", t => EvidenceItem.Note("x", SampleCases.ReviewerA, t), SampleCases.ReviewerA, at));
            Assert.Contains("no checklist item 'gamma.nine'", noItem.Message, StringComparison.Ordinal);
            var empty = await Assert.ThrowsAsync<ArgumentException>(() => AppendAsync(gate, id, "alpha.one", t => EvidenceItem.Note("  ", SampleCases.ReviewerA, t), SampleCases.ReviewerA, at));
            Assert.Contains("empty", empty.Message, StringComparison.Ordinal);

            // A good append in the same batch as the failures is stored; the failures leave nothing behind.
            Assert.NotNull(await AppendAsync(gate, id, "alpha.one", t => EvidenceItem.Note("Kept.", SampleCases.ReviewerA, t), SampleCases.ReviewerA, at));
        }
        finally
        {
            await DisposeGateAsync(gate);
        }

        var loaded = await LoadAsync(id);
        Assert.Equal(2, loaded.Timeline.Count);
        Assert.Single(loaded.Items.SelectMany(i => i.Evidence));

        // Close the case through the aggregate (every item signed), then try to append.
        var closedId = await SaveNewAsync(ClosedCase(NewCandidateId()));
        var closedBefore = await LoadAsync(closedId);
        gate = NewGate();
        try
        {
            var closed = await Assert.ThrowsAsync<DomainRuleException>(() => AppendAsync(gate, closedId, "beta.one", t => EvidenceItem.Note("Too late.", SampleCases.ReviewerA, t), SampleCases.ReviewerA, at.AddDays(1)));
            Assert.Equal("case-closed", closed.Rule);
        }
        finally
        {
            await DisposeGateAsync(gate);
        }

        Assert.Equal(closedBefore.Version, (await LoadAsync(closedId)).Version);
    }

    [Fact]
    public async Task Concurrent_short_appends_to_one_case_keep_one_unbroken_timeline()
    {
        var id = await SaveNewAsync(SampleCases.Open(NewCandidateId()));
        var gate = NewGate();
        const int Writers = 8, Each = 15;
        try
        {
            var start = SampleCases.T0.AddHours(3);
            await Task.WhenAll(Enumerable.Range(0, Writers).Select(w => Task.Run(async () =>
            {
                for (var n = 0; n < Each; n++)
                {
                    var key = n % 2 == 0 ? "alpha.one" : "beta.one";
                    var at = start.AddMilliseconds((w * Each) + n);
                    Assert.NotNull(await AppendAsync(gate, id, key, t => EvidenceItem.Note($"Writer {w} note {n}.", SampleCases.ReviewerA, t), SampleCases.ReviewerA, at));
                }
            })));
        }
        finally
        {
            await DisposeGateAsync(gate);
        }

        var c = await LoadAsync(id);
        Assert.Equal(1 + (Writers * Each), c.Timeline.Count);
        Assert.Equal(Enumerable.Range(1, 1 + (Writers * Each)), c.Timeline.Select(a => a.Sequence).Order());
        Assert.Null(TimelineChain.FirstProblem(c.Timeline.OrderBy(a => a.Sequence)));
        Assert.Equal(Writers * Each, c.Items.Sum(i => i.Evidence.Count));
        Assert.Equal(1 + (Writers * Each), c.Version);
    }

    private static ReviewCase ClosedCase(string candidateId)
    {
        var c = SampleCases.Open(candidateId);
        var t = SampleCases.T0;
        DateTimeOffset Next() => t = t.AddSeconds(1);
        foreach (var item in c.Items)
        {
            var at = Next();
            c.AddEvidence(item.Key, EvidenceItem.Note("Done.", SampleCases.ReviewerA, at), SampleCases.ReviewerA, at);
            c.MarkItemReady(item.Key, SampleCases.ReviewerA, Next());
            foreach (var signer in new[] { SampleCases.ReviewerB, SampleCases.ReviewerC }.Take(item.RequiredSignOffs))
            {
                at = Next();
                c.SignItem(item.Key, signer, SignOffMeaning.Approved, "Fine.", c.Item(item.Key).Fingerprint(), at, EventReview.Core.Time.GpsUtc.FromUtc(at.UtcDateTime));
            }
        }

        c.Close(CaseOutcome.Astrophysical, "Closed for the test.", SampleCases.Coordinator, Next());
        return c;
    }
}
