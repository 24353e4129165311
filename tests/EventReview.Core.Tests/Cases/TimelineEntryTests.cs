using System.Security.Cryptography;
using System.Text;
using EventReview.Core.Cases;
using EventReview.Core.Tests.Dossier;

namespace EventReview.Core.Tests.Cases;

public class TimelineEntryTests
{
    [Fact]
    public void Static_hash_from_plain_values_equals_every_entry_hash()
    {
        var c = SampleCase.Build().Case;

        Assert.True(c.Timeline.Count > 10);
        foreach (var e in c.Timeline)
        {
            Assert.Equal(e.Hash, TimelineEntry.ComputeHash(c.CandidateId, e.Sequence, e.At, e.ActorId, e.ActorName, e.Kind, e.ItemKey, e.Text, e.Facts, e.PreviousHash));
            Assert.True(e.HashMatches());
        }

        Assert.Null(TimelineChain.FirstProblem(c.Timeline));
    }

    [Fact]
    public void First_entry_hash_matches_the_documented_canonical_text()
    {
        var c = SampleCase.Build().Case;
        var e = c.Timeline[0];

        // Oracle: version-2 content written out by hand from the TimelineEntry remarks (each field as length:value).
        static string F(string v) => $"{v.Length}:{v}\n";
        var text = "eventreview-activity-v2\n" + F("ER-C-0314") + F("1") + F("2031-03-14T09:26:53.0000000Z") + F("u-coord") + F("Ada Quill")
            + F("case.opened") + F(string.Empty) + F(e.Text) + F(e.Facts!) + F(TimelineEntry.GenesisHash);

        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text))), e.Hash);
        Assert.Equal(text, e.CanonicalContent());
        Assert.StartsWith("case.candidate=ER-C-0314\n", e.Facts, StringComparison.Ordinal);
    }

    [Fact]
    public void An_entry_without_facts_keeps_the_version_1_canonical_text()
    {
        // Oracle: version-1 content written out by hand from the TimelineEntry remarks.
        var at = new DateTimeOffset(2031, 3, 14, 9, 26, 53, TimeSpan.Zero);
        var text = $"eventreview-activity-v1\nER-C-0314\n1\n2031-03-14T09:26:53.0000000Z\nu-coord\nAda Quill\ncase.opened\n\nOpened.\n{TimelineEntry.GenesisHash}";

        Assert.Equal(text, TimelineEntry.ComputeCanonicalContent("ER-C-0314", 1, at, "u-coord", "Ada Quill", "case.opened", null, "Opened.", null, TimelineEntry.GenesisHash));
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text))),
            TimelineEntry.ComputeHash("ER-C-0314", 1, at, "u-coord", "Ada Quill", "case.opened", null, "Opened.", null, TimelineEntry.GenesisHash));
    }

    [Fact]
    public void Moving_text_between_the_entry_text_and_its_facts_changes_the_version_2_hash()
    {
        var at = new DateTimeOffset(2031, 3, 14, 9, 26, 53, TimeSpan.Zero);

        Assert.NotEqual(
            TimelineEntry.ComputeHash("c", 1, at, "u", "n", "k", null, "A\nB", "case.state=Open", TimelineEntry.GenesisHash),
            TimelineEntry.ComputeHash("c", 1, at, "u", "n", "k", null, "A", "B\ncase.state=Open", TimelineEntry.GenesisHash));
    }

    [Fact]
    public void Time_offset_does_not_change_the_hash_of_the_same_instant()
    {
        var utc = new DateTimeOffset(2031, 1, 1, 12, 0, 0, TimeSpan.Zero);
        var local = utc.ToOffset(TimeSpan.FromHours(5.5));

        Assert.Equal(TimelineEntry.ComputeHash("c", 1, utc, "u", "n", "k", null, "t", string.Empty, TimelineEntry.GenesisHash),
            TimelineEntry.ComputeHash("c", 1, local, "u", "n", "k", null, "t", string.Empty, TimelineEntry.GenesisHash));
    }
}
