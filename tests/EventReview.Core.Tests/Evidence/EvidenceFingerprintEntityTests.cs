using System.Security.Cryptography;
using System.Text;
using EventReview.Core.Evidence;
using EventReview.Core.Tests.Builders;

namespace EventReview.Core.Tests.Evidence;

public class EvidenceFingerprintEntityTests
{
    private static string Sha(string s) => Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(s)));

    [Fact]
    public void An_item_without_evidence_has_the_fingerprint_of_the_header_line_alone()
    {
        Assert.Equal(Sha("eventreview-evidence-v1\n"), EvidenceFingerprint.Compute(Array.Empty<EvidenceItem>(), Array.Empty<ComputationRecord>()));
    }

    [Fact]
    public void The_fingerprint_follows_the_documented_canonical_lines()
    {
        var at = Clock.T0;
        var note = EvidenceItem.Note("abc", People.ReviewerA, at);
        var link = EvidenceItem.Link("https://x.invalid/", "", People.ReviewerA, at.AddSeconds(1));
        var record = new ComputationRecord("overlap", "{}", new string('f', 64), "1", "{}", "clear", "", "", People.ReviewerA, at.AddSeconds(2));

        var expected = Sha("eventreview-evidence-v1\n" +
            $"note|{note.ContentSha256}|{at.UtcTicks}\n" +
            $"link|{link.ContentSha256}|{at.AddSeconds(1).UtcTicks}\n" +
            $"computation|{record.ContentSha256}|{at.AddSeconds(2).UtcTicks}\n");

        Assert.Equal(expected, EvidenceFingerprint.Compute([link, note], [record]));
    }

    [Fact]
    public void The_fingerprint_changes_with_the_content_and_with_the_time_a_piece_was_added()
    {
        var a = EvidenceItem.Note("one", People.ReviewerA, Clock.T0);
        var baseline = EvidenceFingerprint.Compute([a], []);

        Assert.NotEqual(baseline, EvidenceFingerprint.Compute([EvidenceItem.Note("two", People.ReviewerA, Clock.T0)], []));
        Assert.NotEqual(baseline, EvidenceFingerprint.Compute([EvidenceItem.Note("one", People.ReviewerA, Clock.T0.AddMilliseconds(1))], []));
        Assert.NotEqual(baseline, EvidenceFingerprint.Compute([a, EvidenceItem.Note("one", People.ReviewerA, Clock.T0)], []));
        Assert.Equal(baseline, EvidenceFingerprint.Compute([EvidenceItem.Note("one", People.ReviewerB, Clock.T0)], []));
    }

    [Fact]
    public void A_frozen_configuration_fingerprint_is_part_of_the_evidence_when_given()
    {
        var without = EvidenceFingerprint.Compute(Array.Empty<EvidenceItem>(), Array.Empty<ComputationRecord>());

        var with = EvidenceFingerprint.Compute(Array.Empty<EvidenceItem>(), Array.Empty<ComputationRecord>(), new string('9', 64));

        Assert.NotEqual(without, with);
        Assert.Equal(Sha("eventreview-evidence-v1\nconfiguration|" + new string('9', 64) + "\n"), with);
    }

    [Fact]
    public void An_item_fingerprint_changes_with_every_piece_of_evidence_added()
    {
        var c = new CaseBuilder().Build();
        var seen = new HashSet<string> { c.Item("alpha.one").Fingerprint() };

        for (var i = 0; i < 5; i++)
        {
            c.AddNote("alpha.one", "same text every time", People.ReviewerA, Clock.At(i + 1));
            Assert.True(seen.Add(c.Item("alpha.one").Fingerprint()), $"fingerprint repeated after note {i + 1}");
        }
    }
}
