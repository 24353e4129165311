using System.Text.Json.Nodes;
using EventReview.Core.Cases;
using EventReview.Core.Dossier;
using EventReview.Core.Evidence;
using EventReview.Core.Tests.Records;

namespace EventReview.Core.Tests.Dossier;

/// <summary>
/// A forger edits dossier.json and recomputes the manifest (file hashes, chain head), leaving it unsigned or signing it
/// with a key of their own. No such dossier may verify as valid; one whose data contradict its own signed timeline is
/// reported invalid, naming what.
/// </summary>
public class DossierForgeryTests
{
    private static Dictionary<string, byte[]> Files()
    {
        var s = SampleCase.Build();
        return DossierFiles.From(DossierBuilder.Build(s.Case, s.Sites, s.Snapshots), new Dictionary<string, byte[]> { [s.AttachmentSha256] = SampleCase.AttachmentBytes });
    }

    /// <summary>Each forgery of dossier.json, by name.</summary>
    public static TheoryData<string> Forgeries => new(Edits.Keys);

    private static readonly Dictionary<string, Action<JsonNode>> Edits = new()
    {
        ["outcome"] = n =>
        {
            n["case"]!["state"] = "closed";
            n["case"]!["outcome"] = "astrophysical";
            n["case"]!["closingStatement"] = "Confirmed by the decision board.";
        },
        ["sign-off statement"] = n => n["items"]![0]!["signOffs"]![0]!["statement"] = "Delays checked twice, all clear.",
        ["sign-off signer"] = n => n["items"]![0]!["signOffs"]![0]!["signerName"] = "Someone Senior",
        ["sign-off time"] = n =>
        {
            var s = n["items"]![0]!["signOffs"]![0]!;
            var ticks = s["signedAtUtcTicks"]!.GetValue<long>() - TimeSpan.TicksPerDay;
            s["signedAtUtcTicks"] = ticks;
            s["signedAtUtc"] = TimelineEntry.FormatUtc(new DateTimeOffset(ticks, TimeSpan.Zero));
        },
        ["note text with its hash"] = n =>
        {
            var e = n["items"]![0]!["evidence"]![0]!;
            e["text"] = "Delay is 3 ms.";
            e["contentSha256"] = Hashing.Sha256Hex("Delay is 3 ms.");
        },
        ["verdict with its hash"] = n =>
        {
            var r = n["items"]![0]!["computations"]![0]!;
            r["verdict"] = "inconsistent";
            r["contentSha256"] = ComputationRecord.ComputeContentSha256(r["kind"]!.GetValue<string>(), r["parametersJson"]!.GetValue<string>(),
                r["inputFingerprint"]!.GetValue<string>(), r["toolVersion"]!.GetValue<string>(), r["resultJson"]!.GetValue<string>(), "inconsistent");
        },
        ["item state"] = n => n["items"]![1]!["state"] = "signed off",
        ["stale mark removed"] = n => n["items"]![1]!["signOffs"]![0]!["isStale"] = false,
        ["arrival time"] = n => n["arrivals"]![0]!["arrivalGpsNanoseconds"] = n["arrivals"]![0]!["arrivalGpsNanoseconds"]!.GetValue<long>() + 5_000_000,
        ["frozen configuration reason"] = n => n["configurations"]!.AsArray().First(c => c!["isFrozen"]!.GetValue<bool>())!["freezeReason"] = "Routine.",
        ["signed-off count"] = n => n["case"]!["signedItemCount"] = 3,
    };

    [Theory]
    [MemberData(nameof(Forgeries))]
    public void An_edited_dossier_with_a_recomputed_unsigned_manifest_is_invalid(string forgery)
    {
        var files = Files();
        DossierFiles.EditDossier(files, Edits[forgery]);

        var v = DossierFiles.Verify(files);

        Assert.Equal(DossierVerification.InvalidWord, v.Status);
        Assert.Contains(v.Problems, p => p.File == DossierManifest.DossierFileName);
    }

    [Theory]
    [MemberData(nameof(Forgeries))]
    public void An_edited_dossier_signed_with_the_forger_s_own_key_never_verifies(string forgery)
    {
        var files = Files();
        DossierFiles.EditDossier(files, Edits[forgery]);
        var manifest = DossierJson.Deserialize<DossierManifest>(files[DossierManifest.FileName]);
        DossierFiles.Reseal(files, manifest.ChainHead, manifest.CandidateId, manifest.HeadSequence, TestSigner.Other());

        var v = DossierFiles.Verify(files);

        Assert.False(v.Valid);
        Assert.Equal(DossierVerification.InvalidWord, v.Status);
        Assert.Contains("which is not one of the 1 trusted key(s)", v.Signature, StringComparison.Ordinal);
    }

    [Fact]
    public void A_forgery_that_also_rewrites_the_timeline_to_agree_is_at_best_unsigned()
    {
        // The forger closes the case as astrophysical in the data and appends a matching "case.closed" entry to the
        // timeline (facts included), recomputing its hash, the chain head and the manifest: everything agrees, but only
        // the server's key could sign it.
        var files = Files();
        DossierFiles.EditDossier(files, n =>
        {
            var timeline = n["timeline"]!.AsArray();
            var last = timeline[^1]!;
            var (seq, ticks) = (last["sequence"]!.GetValue<int>() + 1, last["atUtcTicks"]!.GetValue<long>() + TimeSpan.TicksPerMinute);
            const string Text = "Case closed as astrophysical: Confirmed.";
            const string Facts = "case.state=Closed\ncase.outcome=Astrophysical\ncase.closing=Confirmed.";
            var at = new DateTimeOffset(ticks, TimeSpan.Zero);
            var hash = TimelineEntry.ComputeHash(n["case"]!["candidateId"]!.GetValue<string>(), seq, at, "u-coord", "Ada Quill", "case.closed", null, Text, Facts, last["hash"]!.GetValue<string>());
            timeline.Add(new JsonObject
            {
                ["sequence"] = seq, ["atUtc"] = TimelineEntry.FormatUtc(at), ["atUtcTicks"] = ticks, ["actorId"] = "u-coord", ["actorName"] = "Ada Quill",
                ["kind"] = "case.closed", ["itemKey"] = null, ["text"] = Text, ["previousHash"] = last["hash"]!.GetValue<string>(), ["hash"] = hash,
                ["facts"] = Facts, ["keyId"] = null, ["mac"] = null,
            });
            n["chainHead"] = hash;
            n["case"]!["state"] = "closed";
            n["case"]!["outcome"] = "astrophysical";
            n["case"]!["closingStatement"] = "Confirmed.";
            n["case"]!["updatedAtUtcTicks"] = ticks;
            n["case"]!["updatedAtUtc"] = TimelineEntry.FormatUtc(at);
        });
        var doc = DossierJson.Deserialize<DossierDocument>(files[DossierManifest.DossierFileName]);
        DossierFiles.Reseal(files, doc.ChainHead, doc.Case.CandidateId, doc.Timeline[^1].Sequence);

        var v = DossierFiles.Verify(files);

        Assert.Empty(v.Problems);
        Assert.Equal((false, DossierVerification.UnsignedWord), (v.Valid, v.Status));
        Assert.Equal("the manifest carries no signature", v.Signature);
    }

    [Fact]
    public void A_signed_manifest_whose_listed_hashes_were_changed_afterwards_is_invalid()
    {
        var files = Files();
        var node = JsonNode.Parse(files[DossierManifest.FileName])!;
        node["files"]![0]!["sizeBytes"] = 1;
        files[DossierManifest.FileName] = System.Text.Encoding.UTF8.GetBytes(node.ToJsonString(DossierJson.Options) + "\n");

        var v = DossierFiles.Verify(files);

        Assert.Equal(DossierVerification.InvalidWord, v.Status);
        Assert.Contains(v.Problems, p => p.File == DossierManifest.FileName && p.Where == "signature" && p.What.Contains("changed after it was signed", StringComparison.Ordinal));
    }

    [Fact]
    public void An_untouched_dossier_is_unsigned_without_a_trusted_key_and_valid_with_it()
    {
        var files = Files();

        Assert.Equal(DossierVerification.UnsignedWord, DossierVerifier.Verify(files).Status);
        Assert.Equal(DossierVerification.UnsignedWord, DossierVerifier.Verify(files, [TestSigner.Other().Public]).Status);
        Assert.Equal(DossierVerification.ValidWord, DossierVerifier.Verify(files, [TestSigner.Other().Public, TestSigner.Instance.Public]).Status);
    }
}
