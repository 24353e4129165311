using System.Text;
using System.Text.Json.Nodes;
using EventReview.Core.Dossier;
using EventReview.Core.Tests.Records;

namespace EventReview.Core.Tests.Dossier;

public class DossierVerifierTests
{
    private static Dictionary<string, byte[]> Files()
    {
        var s = SampleCase.Build();
        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);
        return DossierFiles.From(doc, new Dictionary<string, byte[]> { [s.AttachmentSha256] = SampleCase.AttachmentBytes });
    }

    /// <summary>The first problem of an altered dossier (the first thing that does not match), which must be reported invalid.</summary>
    private static DossierProblem First(Dictionary<string, byte[]> files)
    {
        var v = DossierFiles.Verify(files);
        Assert.Equal((false, DossierVerification.InvalidWord), (v.Valid, v.Status));
        return v.Problems[0];
    }

    [Fact]
    public void An_untouched_dossier_is_valid()
    {
        var v = DossierFiles.Verify(Files());

        Assert.True(v.Valid, string.Join("\n", v.Problems) + " " + v.Signature);
        Assert.Equal(DossierVerification.ValidWord, v.Status);
        Assert.Equal(TestSigner.Instance.KeyId, v.SignedBy);
    }

    [Fact]
    public void An_altered_file_is_named()
    {
        var files = Files();
        files["pictures/1.svg"] = Encoding.UTF8.GetBytes("<svg/>");

        var p = First(files);

        Assert.Equal("pictures/1.svg", p.File);
        Assert.Contains("altered", p.What);
    }

    [Fact]
    public void A_missing_file_is_named()
    {
        var files = Files();
        files.Remove("pictures/2.svg");

        var problems = DossierFiles.Verify(files).Problems;

        Assert.Contains(problems, p => p.File == "pictures/2.svg" && p.What.Contains("missing from the ZIP"));
    }

    [Fact]
    public void An_extra_file_is_named()
    {
        var files = Files();
        files["notes/extra.txt"] = [1, 2, 3];

        var p = First(files);

        Assert.Equal("notes/extra.txt", p.File);
        Assert.Contains("not listed", p.What);
    }

    [Fact]
    public void An_altered_timeline_text_names_the_entry_even_when_the_manifest_is_resealed()
    {
        var files = Files();
        DossierFiles.EditDossier(files, n => n["timeline"]![3]!["text"] = "Nothing happened.");

        var p = First(files);

        Assert.Equal("dossier.json", p.File);
        Assert.StartsWith("timeline entry 4 (", p.Where);
        Assert.Contains("was altered", p.What);
    }

    [Fact]
    public void A_broken_link_in_the_chain_is_named()
    {
        var files = Files();
        DossierFiles.EditDossier(files, n => ((JsonArray)n["timeline"]!).RemoveAt(2));

        var p = First(files);

        Assert.StartsWith("timeline entry 4 (", p.Where);
        Assert.Contains("expected entry 3", p.What);
    }

    [Fact]
    public void A_removed_last_entry_is_caught_by_the_chain_head()
    {
        var files = Files();
        DossierFiles.EditDossier(files, n => ((JsonArray)n["timeline"]!).RemoveAt(((JsonArray)n["timeline"]!).Count - 1));

        var p = First(files);

        Assert.Equal("chainHead", p.Where);
    }

    [Fact]
    public void A_relinked_chain_with_a_new_head_is_caught_by_the_manifest_chain_head()
    {
        var files = Files();
        DossierFiles.EditDossier(files, n =>
        {
            var timeline = (JsonArray)n["timeline"]!;
            timeline.RemoveAt(timeline.Count - 1);
            n["chainHead"] = timeline[^1]!["hash"]!.GetValue<string>();
        });

        var p = First(files);

        Assert.Equal("manifest.json", p.File);
        Assert.Equal("chainHead", p.Where);
    }

    [Fact]
    public void An_altered_note_breaks_the_item_fingerprint()
    {
        var files = Files();
        DossierFiles.EditDossier(files, n => n["items"]![0]!["evidence"]![0]!["text"] = "Delay is 70 ms.");

        var problems = DossierFiles.Verify(files).Problems;

        Assert.Contains(problems, p => p.Where!.StartsWith("item timing.delay, note", StringComparison.Ordinal) && p.What.Contains("note was altered"));
        Assert.Contains(problems, p => p.Where == "item timing.delay" && p.What.Contains("evidence fingerprint recomputed"));
        Assert.Contains(problems, p => p.Where!.StartsWith("item timing.delay, sign-off", StringComparison.Ordinal) && p.What.Contains("marked current"));
    }

    [Fact]
    public void An_altered_computation_result_is_caught()
    {
        var files = Files();
        DossierFiles.EditDossier(files, n => n["items"]![0]!["computations"]![0]!["resultJson"] = "{\"delaySeconds\":0.002}");

        var problems = DossierFiles.Verify(files).Problems;

        Assert.Contains(problems, p => p.Where!.Contains("computation") && p.What.Contains("altered"));
    }

    [Fact]
    public void An_altered_sign_off_fingerprint_is_caught()
    {
        var files = Files();
        DossierFiles.EditDossier(files, n => n["items"]![0]!["signOffs"]![0]!["evidenceFingerprint"] = new string('0', 64));

        var p = First(files);

        Assert.StartsWith("item timing.delay, sign-off", p.Where);
        Assert.Contains("Cleo Vance", p.Where);
    }

    [Fact]
    public void A_stale_sign_off_with_an_old_fingerprint_is_fine_but_unmarking_it_is_caught()
    {
        var files = Files();
        DossierFiles.EditDossier(files, n => n["items"]![1]!["signOffs"]![0]!["isStale"] = false);

        var p = First(files);

        Assert.StartsWith("item timing.notes, sign-off", p.Where);
    }

    [Fact]
    public void An_altered_frozen_configuration_item_is_caught()
    {
        var files = Files();
        DossierFiles.EditDossier(files, n => n["configurations"]![0]!["items"]![1]!["value"] = "4.2.2");

        var p = First(files);

        Assert.StartsWith("configuration", p.Where);
        Assert.Contains("frozen configuration recomputes", p.What);
    }

    [Fact]
    public void Altered_attachment_bytes_are_caught_even_with_a_resealed_manifest()
    {
        var s = SampleCase.Build();
        var files = Files();
        var path = s.AttachmentPath;
        files[path] = Encoding.UTF8.GetBytes("gps_time,value\n1.0,9.0\n");
        var manifest = JsonNode.Parse(files["manifest.json"])!;
        DossierFiles.Reseal(files, manifest["chainHead"]!.GetValue<string>(), manifest["candidateId"]!.GetValue<string>());

        var problems = DossierFiles.Verify(files).Problems;

        Assert.Contains(problems, p => p.Where!.Contains("attachment") && p.What.Contains("attachment was altered"));
    }

    [Fact]
    public void A_wrong_schema_version_and_bad_json_are_reported_not_thrown()
    {
        var files = Files();
        DossierFiles.EditDossier(files, n => n["schemaVersion"] = "eventreview-dossier/9");
        Assert.Equal("schemaVersion", First(files).Where);

        files = Files();
        files["dossier.json"] = Encoding.UTF8.GetBytes("{\"schemaVersion\": ");
        DossierFiles.Reseal(files, "x", "y");
        Assert.Contains(DossierFiles.Verify(files).Problems, p => p.File == "dossier.json" && p.What.StartsWith("not a valid dossier", StringComparison.Ordinal));

        files = Files();
        files.Remove("manifest.json");
        Assert.Contains(DossierFiles.Verify(files).Problems, p => p.File == "manifest.json" && p.What.StartsWith("missing", StringComparison.Ordinal));
    }
}
