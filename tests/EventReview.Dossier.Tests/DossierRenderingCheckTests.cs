using System.IO.Compression;
using System.Text;
using EventReview.Core.Dossier;

namespace EventReview.Dossier.Tests;

/// <summary>
/// The human-readable files cannot say what the data do not: a forger who edits index.html or swaps in a summary.pdf made
/// from other data, and recomputes the manifest (unsigned, or signed with their own key), is caught by re-rendering both
/// from dossier.json.
/// </summary>
public class DossierRenderingCheckTests
{
    private static async Task<Dictionary<string, byte[]>> FilesAsync() => DossierExporterTests.Entries(await DossierExporterTests.ExportAsync(SampleCase.Build()));

    private static async Task<DossierVerification> VerifyAsync(Dictionary<string, byte[]> files)
    {
        using var ms = new MemoryStream();
        using (var zip = new ZipArchive(ms, ZipArchiveMode.Create, leaveOpen: true))
        {
            foreach (var (name, bytes) in files)
            {
                using var s = zip.CreateEntry(name).Open();
                s.Write(bytes);
            }
        }

        ms.Position = 0;
        return await DossierArchive.VerifyAsync(ms, DossierFiles.Trusted);
    }

    private static void Reseal(Dictionary<string, byte[]> files, Core.Records.IRecordSigner? signer = null)
    {
        var manifest = DossierJson.Deserialize<DossierManifest>(files[DossierManifest.FileName]);
        DossierFiles.Reseal(files, manifest.ChainHead, manifest.CandidateId, manifest.HeadSequence, signer);
    }

    [Fact]
    public async Task An_untouched_export_re_renders_to_the_same_page_and_pdf_text()
    {
        var v = await VerifyAsync(await FilesAsync());

        Assert.True(v.Valid, string.Join("\n", v.Problems) + " " + v.Signature);
    }

    [Theory]
    [InlineData(null)]
    [InlineData("forger")]
    public async Task An_edited_index_html_with_a_recomputed_manifest_is_invalid(string? signedBy)
    {
        var files = await FilesAsync();
        files["index.html"] = Encoding.UTF8.GetBytes(Encoding.UTF8.GetString(files["index.html"]).Replace("Cleo Vance", "Someone Senior", StringComparison.Ordinal));
        Reseal(files, signedBy is null ? null : TestSigner.Other());

        var v = await VerifyAsync(files);

        Assert.Equal(DossierVerification.InvalidWord, v.Status);
        var p = Assert.Single(v.Problems);
        Assert.Equal("index.html", p.File);
        Assert.Contains("says something the data do not", p.What, StringComparison.Ordinal);
        Assert.StartsWith("line ", p.Where, StringComparison.Ordinal);
        Assert.Contains("shows '", p.What, StringComparison.Ordinal);
        Assert.Contains("Someone Senior", p.What, StringComparison.Ordinal);
        Assert.Contains("Cleo Vance", p.What, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_summary_pdf_made_from_other_data_is_invalid_naming_the_first_text_that_differs()
    {
        var s = SampleCase.Build();
        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);
        var files = await FilesAsync();
        files["summary.pdf"] = DossierPdf.Render(doc with { Case = doc.Case with { State = "closed", Outcome = "astrophysical" } });
        Reseal(files);

        var v = await VerifyAsync(files);

        Assert.Equal(DossierVerification.InvalidWord, v.Status);
        var p = Assert.Single(v.Problems);
        Assert.Equal("summary.pdf", p.File);
        Assert.Contains("Closed: astrophysical", p.What, StringComparison.Ordinal);
        Assert.Contains("Open: the review is in review", p.What, StringComparison.Ordinal);
    }

    [Fact]
    public async Task A_readable_file_matching_forged_data_is_still_caught_by_the_data_and_the_signature()
    {
        // The forger changes the outcome in dossier.json and re-renders both readable files from it: they agree, but the
        // data contradict the signed timeline and the manifest is not signed by the server.
        var s = SampleCase.Build();
        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);
        var forged = doc with { Case = doc.Case with { State = "closed", Outcome = "astrophysical", ClosingStatement = "Confirmed." } };
        var files = await FilesAsync();
        files["dossier.json"] = DossierJson.Serialize(forged);
        files["index.html"] = DossierHtml.Render(forged with { PictureSvgs = doc.PictureSvgs });
        files["summary.pdf"] = DossierPdf.Render(forged);
        Reseal(files, TestSigner.Other());

        var v = await VerifyAsync(files);

        Assert.Equal(DossierVerification.InvalidWord, v.Status);
        Assert.DoesNotContain(v.Problems, p => p.File is "index.html" or "summary.pdf");
        Assert.Contains(v.Problems, p => p.File == "dossier.json" && p.What.Contains("state is 'closed' in the dossier, but the signed record says 'in review'", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Pdf_text_is_what_the_summary_shows()
    {
        var text = PdfText.Extract((await FilesAsync())["summary.pdf"]);

        Assert.Contains("ER-C-0314", text);
        Assert.Contains(text, t => t.StartsWith("Cleo Vance, approved, ", StringComparison.Ordinal) && t.Contains("STALE since", StringComparison.Ordinal));
        Assert.Empty(PdfText.Extract("not a pdf"u8.ToArray()));
    }
}
