using System.Security.Cryptography;
using System.Text;
using EventReview.Core.Evidence;
using EventReview.Core.Tests.Dossier;

namespace EventReview.Core.Tests.Evidence;

public class EvidenceFingerprintTests
{
    [Fact]
    public void Plain_lines_give_the_same_fingerprint_as_the_entities_for_every_item()
    {
        var c = SampleCase.Build().Case;

        foreach (var item in c.Items)
        {
            var plain = EvidenceFingerprint.Compute(EvidenceFingerprint.Lines(item.Evidence), EvidenceFingerprint.Lines(item.Computations));
            Assert.Equal(item.Fingerprint(), plain);
            Assert.Equal(EvidenceFingerprint.Compute(item.Evidence, item.Computations, new string('c', 64)),
                EvidenceFingerprint.Compute(EvidenceFingerprint.Lines(item.Evidence), EvidenceFingerprint.Lines(item.Computations), new string('c', 64)));
        }
    }

    [Fact]
    public void Fingerprint_matches_the_documented_canonical_text()
    {
        var item = SampleCase.Build().Case.Item("timing.delay");
        var e = item.Evidence;
        var r = item.Computations[0];

        // Oracle: the v1 text written out by hand from the format in the class remarks.
        var text = "eventreview-evidence-v1\n" +
                   $"note|{e[0].ContentSha256}|{e[0].AddedAt.UtcTicks}\n" +
                   $"attachment|{e[1].ContentSha256}|{e[1].AddedAt.UtcTicks}\n" +
                   $"link|{e[2].ContentSha256}|{e[2].AddedAt.UtcTicks}\n" +
                   $"computation|{r.ContentSha256}|{r.RunAt.UtcTicks}\n";
        var expected = Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text)));

        Assert.Equal(expected, item.Fingerprint());
        Assert.Equal(text, EvidenceFingerprint.CanonicalText(EvidenceFingerprint.Lines(e), EvidenceFingerprint.Lines(item.Computations)));
    }

    [Fact]
    public void Computation_content_hash_from_plain_values_matches_the_record()
    {
        var r = SampleCase.Build().Case.Item("timing.delay").Computations[0];
        var text = $"{r.Kind}\n{r.ParametersJson}\n{r.InputFingerprint}\n{r.ToolVersion}\n{r.ResultJson}\n{r.Verdict}";

        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(text))), r.ContentSha256);
        Assert.Equal(r.ContentSha256, ComputationRecord.ComputeContentSha256(r.Kind, r.ParametersJson, r.InputFingerprint, r.ToolVersion, r.ResultJson, r.Verdict));
    }

    [Fact]
    public void Lines_with_equal_times_keep_their_given_order()
    {
        var a = new EvidenceLine("note", new string('a', 64), 5);
        var b = new EvidenceLine("note", new string('b', 64), 5);

        Assert.NotEqual(EvidenceFingerprint.Compute([a, b], []), EvidenceFingerprint.Compute([b, a], []));
        Assert.Equal(EvidenceFingerprint.Compute([a, b], []), EvidenceFingerprint.Compute([a, b], []));
    }
}
