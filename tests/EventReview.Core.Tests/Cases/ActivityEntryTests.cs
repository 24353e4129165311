using System.Security.Cryptography;
using System.Text;
using EventReview.Core.Cases;
using EventReview.Core.Tests.Dossier;

namespace EventReview.Core.Tests.Cases;

public class ActivityEntryTests
{
    [Fact]
    public void Static_hash_from_plain_values_equals_every_entry_hash()
    {
        var c = SampleCase.Build().Case;

        Assert.True(c.Activity.Count > 10);
        foreach (var e in c.Activity)
        {
            Assert.Equal(e.Hash, ActivityEntry.ComputeHash(c.CandidateId, e.Sequence, e.At, e.ActorId, e.ActorName, e.Kind, e.ItemKey, e.Text, e.PreviousHash));
            Assert.True(e.HashMatches());
        }

        Assert.Null(ActivityChain.FirstProblem(c.Activity));
    }

    [Fact]
    public void First_entry_hash_matches_the_documented_canonical_text()
    {
        var c = SampleCase.Build().Case;
        var e = c.Activity[0];

        // Oracle: version-1 content written out by hand from the ActivityEntry remarks.
        var text = $"eventreview-activity-v1\nER-C-0314\n1\n2031-03-14T09:26:53.0000000Z\nu-coord\nAda Quill\ncase.opened\n\n{e.Text}\n{ActivityEntry.GenesisHash}";

        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text))), e.Hash);
        Assert.Equal(text, e.CanonicalContent());
    }

    [Fact]
    public void Time_offset_does_not_change_the_hash_of_the_same_instant()
    {
        var utc = new DateTimeOffset(2031, 1, 1, 12, 0, 0, TimeSpan.Zero);
        var local = utc.ToOffset(TimeSpan.FromHours(5.5));

        Assert.Equal(ActivityEntry.ComputeHash("c", 1, utc, "u", "n", "k", null, "t", ActivityEntry.GenesisHash),
            ActivityEntry.ComputeHash("c", 1, local, "u", "n", "k", null, "t", ActivityEntry.GenesisHash));
    }
}
