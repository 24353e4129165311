using EventReview.Core.Cases;
using EventReview.Core.Records;
using EventReview.Core.Tests.Dossier;

namespace EventReview.Core.Tests.Records;

public class CaseReplayTests
{
    private static CaseReplay.Entry E(int seq, string? facts, string kind = "item.state") => new(seq, kind, "Ada Quill", 630_000_000_000_000_000 + seq, facts);

    [Fact]
    public void Replaying_a_worked_case_gives_exactly_its_stored_fields_and_rows()
    {
        var c = SampleCase.Build(freezeInTimeline: false).Case;

        var recorded = CaseReplay.Replay(c.Timeline.Select(a => new CaseReplay.Entry(a.Sequence, a.Kind, a.ActorName, a.At.UtcTicks, a.Facts)));

        Assert.Empty(recorded.Problems);
        Assert.Empty(CaseRecordCheck.Compare(c.CandidateId, recorded, StoredCase.Of(c, null)));
        Assert.Equal(c.Items.Sum(i => i.Evidence.Count + i.Computations.Count + i.SignOffs.Count), recorded.Rows.Count);
        Assert.Single(recorded.Rows, r => r.Stale is not null);
    }

    [Fact]
    public void Later_facts_replace_earlier_ones_and_name_their_entry()
    {
        var recorded = CaseReplay.Replay([E(2, "item[a].state=ReadyForSignOff"), E(1, "item[a].state=InProgress\ncase.state=InReview")]);

        Assert.Equal(("ReadyForSignOff", 2), recorded.Fields["item[a].state"]);
        Assert.Equal(("InReview", 1), recorded.Fields["case.state"]);
        Assert.Equal(2, recorded.LastEntry);
    }

    [Fact]
    public void Unknown_facts_malformed_values_and_stale_marks_of_unknown_sign_offs_are_problems_of_their_entry()
    {
        var recorded = CaseReplay.Replay([E(1, "gadget[a]+=1"), E(2, "signoff[a]+=x y z"), E(3, "signoff[a].stale=abc 123"), E(4, "bad line"), E(5, null)]);

        Assert.Equal([1, 2, 3, 4], recorded.Problems.Select(p => p.Entry));
        Assert.Contains("does not know", recorded.Problems[0].What, StringComparison.Ordinal);
        Assert.Contains("malformed", recorded.Problems[1].What, StringComparison.Ordinal);
        Assert.Contains("no earlier entry added", recorded.Problems[2].What, StringComparison.Ordinal);
        Assert.Contains("cannot be read", recorded.Problems[3].What, StringComparison.Ordinal);
        Assert.Equal([5], recorded.WithoutFacts);
    }

    [Fact]
    public void A_case_changed_outside_its_methods_no_longer_matches_its_replay()
    {
        var c = SampleCase.Build(freezeInTimeline: false).Case;
        var recorded = CaseReplay.Replay(c.Timeline.Select(a => new CaseReplay.Entry(a.Sequence, a.Kind, a.ActorName, a.At.UtcTicks, a.Facts)));
        var stored = StoredCase.Of(c, null);
        var fields = new Dictionary<string, string>(stored.Fields) { ["case.state"] = nameof(CaseState.Closed) };

        var p = Assert.Single(CaseRecordCheck.Compare(c.CandidateId, recorded, new StoredCase { Fields = fields, Rows = stored.Rows, UpdatedAtUtcTicks = stored.UpdatedAtUtcTicks }));

        Assert.Equal("The case's state is 'closed' in the database, but the signed record says 'in review' (entry 11).", p.What); // entry 11: the last note, which recorded the case's state
    }
}
