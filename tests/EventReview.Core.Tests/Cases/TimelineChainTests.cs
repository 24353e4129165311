using System.Security.Cryptography;
using System.Text;
using EventReview.Core.Cases;
using EventReview.Core.Tests.Builders;

namespace EventReview.Core.Tests.Cases;

public class TimelineChainTests
{
    /// <summary>A case with a dozen timeline entries of different kinds.</summary>
    private static ReviewCase Worked()
    {
        var c = new CaseBuilder().Build();
        c.AssignItem("alpha.one", People.ReviewerA.UserId, People.ReviewerA.DisplayName, People.Coordinator, Clock.At(1));
        c.StartItem("alpha.one", People.ReviewerA, Clock.At(2));
        c.PrepareForSignOff("alpha.one", People.ReviewerA, Clock.At(3));
        c.SignNow("alpha.one", People.ReviewerB, Clock.At(4));
        c.AddNote("alpha.one", "Addendum.", People.ReviewerA, Clock.At(5));
        c.SignEverything(Clock.At(6));
        c.SubmitForDecision(People.Coordinator, Clock.At(7));
        return c;
    }

    [Fact]
    public void The_timeline_of_a_worked_case_is_an_intact_chain_numbered_from_one()
    {
        var c = Worked();

        Assert.Null(TimelineChain.FirstProblem(c.Timeline));
        Assert.Equal(Enumerable.Range(1, c.Timeline.Count), c.Timeline.Select(a => a.Sequence));
        for (var i = 1; i < c.Timeline.Count; i++)
        {
            Assert.Equal(c.Timeline[i - 1].Hash, c.Timeline[i].PreviousHash);
        }

        Assert.True(c.Timeline.Count >= 12);
    }

    [Fact]
    public void An_empty_timeline_has_nothing_to_report()
    {
        Assert.Null(TimelineChain.FirstProblem([]));
    }

    [Fact]
    public void The_entry_hash_is_sha256_of_the_documented_canonical_lines()
    {
        var e = new CaseBuilder().Build().Timeline[0];
        var lines = "eventreview-activity-v2\n" + string.Concat(new[] { "TC-0001", "1", "2026-03-01T12:00:00.0000000Z",
            People.Coordinator.UserId, People.Coordinator.DisplayName, "case.opened", "", e.Text, e.Facts!, TimelineEntry.GenesisHash }.Select(f => $"{f.Length}:{f}\n"));

        // Oracle: the canonical form (version 2: each field as length:value) written out by hand from the doc comment, hashed with the platform's SHA-256.
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(lines))), e.Hash);
        Assert.True(e.HashMatches());
    }

    [Fact]
    public void Input_order_does_not_matter_because_entries_are_checked_by_sequence()
    {
        var c = Worked();

        Assert.Null(TimelineChain.FirstProblem(c.Timeline.Reverse()));
    }

    [Fact]
    public void An_altered_text_is_caught_and_the_entry_is_named()
    {
        var c = Worked();
        Tamper.Set(c.Timeline[4], nameof(TimelineEntry.Text), "Nothing happened here.");

        var problem = TimelineChain.FirstProblem(c.Timeline);

        Assert.NotNull(problem);
        Assert.StartsWith("Entry 5 ", problem, StringComparison.Ordinal);
        Assert.Contains("altered", problem, StringComparison.Ordinal);
        Assert.Contains(c.Timeline[4].ActorName, problem, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(nameof(TimelineEntry.ActorName), "Someone Else")]
    [InlineData(nameof(TimelineEntry.ActorId), "u-other")]
    [InlineData(nameof(TimelineEntry.Kind), "item.assigned")]
    [InlineData(nameof(TimelineEntry.ItemKey), "beta.one")]
    [InlineData(nameof(TimelineEntry.CandidateId), "TC-9999")]
    public void Altering_any_hashed_field_is_caught(string field, string value)
    {
        var c = Worked();
        Tamper.Set(c.Timeline[2], field, value);

        Assert.StartsWith("Entry 3 ", TimelineChain.FirstProblem(c.Timeline), StringComparison.Ordinal);
    }

    [Fact]
    public void Moving_an_entry_in_time_is_caught()
    {
        var c = Worked();
        Tamper.Set(c.Timeline[3], nameof(TimelineEntry.At), c.Timeline[3].At.AddTicks(1));

        Assert.StartsWith("Entry 4 ", TimelineChain.FirstProblem(c.Timeline), StringComparison.Ordinal);
    }

    [Fact]
    public void A_missing_entry_is_caught_and_named()
    {
        var c = Worked();
        var withGap = c.Timeline.Where(a => a.Sequence != 6).ToList();

        Assert.Equal("Entry 6 is missing (entry 7 follows entry 5).", TimelineChain.FirstProblem(withGap));
    }

    [Fact]
    public void A_missing_last_entry_cannot_be_seen_from_the_chain_alone()
    {
        // Truncation at the end leaves a valid shorter chain: the case's version counter is what shows it.
        var c = Worked();

        Assert.Null(TimelineChain.FirstProblem(c.Timeline.Take(c.Timeline.Count - 1)));
    }

    [Fact]
    public void Two_entries_swapped_in_sequence_are_caught_as_a_broken_link()
    {
        var c = Worked();
        var (a, b) = (c.Timeline[2], c.Timeline[3]);
        Tamper.Set(a, nameof(TimelineEntry.Sequence), 4);
        Tamper.Set(b, nameof(TimelineEntry.Sequence), 3);

        var problem = TimelineChain.FirstProblem(c.Timeline);

        Assert.Equal($"Entry 3 ({b.Kind}) does not link to entry 2: previous-hash mismatch.", problem);
    }

    [Fact]
    public void Rehashing_an_altered_entry_still_breaks_the_link_of_the_next_one()
    {
        var c = Worked();
        var e = c.Timeline[4];
        Tamper.Set(e, nameof(TimelineEntry.Text), "Rewritten.");
        Tamper.Set(e, nameof(TimelineEntry.Hash), Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(e.CanonicalContent()))));

        Assert.True(e.HashMatches());
        Assert.StartsWith("Entry 6 ", TimelineChain.FirstProblem(c.Timeline), StringComparison.Ordinal);
    }

    [Fact]
    public void Refused_changes_do_not_add_entries_to_the_chain()
    {
        var c = Worked();
        var count = c.Timeline.Count;

        Assert.Throws<DomainRuleException>(() => c.SubmitForDecision(People.Coordinator, Clock.At(20)));

        Assert.Equal(count, c.Timeline.Count);
        Assert.Null(TimelineChain.FirstProblem(c.Timeline));
    }
}
