using System.Diagnostics;
using System.IO.Compression;
using System.Text;
using EventReview.Core.Dossier;

namespace EventReview.Dossier.Tests;

public class DossierExporterTests
{
    internal static async Task<byte[]> ExportAsync(SampleCase s)
    {
        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);
        using var ms = new MemoryStream();
        await DossierExporter.ExportAsync(doc, sha => sha == s.AttachmentSha256 ? new MemoryStream(SampleCase.AttachmentBytes) : null, ms, TestSigner.Instance);
        return ms.ToArray();
    }

    internal static Dictionary<string, byte[]> Entries(byte[] zip)
    {
        using var archive = new ZipArchive(new MemoryStream(zip), ZipArchiveMode.Read);
        return archive.Entries.ToDictionary(e => e.FullName, e =>
        {
            using var s = e.Open();
            using var ms = new MemoryStream();
            s.CopyTo(ms);
            return ms.ToArray();
        });
    }

    [Fact]
    public async Task Exporting_an_unchanged_case_twice_gives_identical_files_and_manifest_but_for_the_signature_value()
    {
        var s = SampleCase.Build();

        var a = Entries(await ExportAsync(s));
        var b = Entries(await ExportAsync(s));

        Assert.Equal(a["dossier.json"], b["dossier.json"]);
        Assert.Equal(a["summary.pdf"], b["summary.pdf"]);
        Assert.Equal(a["index.html"], b["index.html"]);
        // ECDSA signatures are randomised: everything but the signature's value is the same, and both verify.
        var (ma, mb) = (DossierJson.Deserialize<DossierManifest>(a["manifest.json"]), DossierJson.Deserialize<DossierManifest>(b["manifest.json"]));
        Assert.Equal(ma.SignedText(), mb.SignedText());
        Assert.Equal(ma.Signature! with { Value = string.Empty }, mb.Signature! with { Value = string.Empty });
        Assert.NotEqual(ma.Signature!.Value, mb.Signature!.Value);
    }

    [Fact]
    public async Task Zip_has_the_fixed_entry_order_and_time()
    {
        var s = SampleCase.Build();
        using var archive = new ZipArchive(new MemoryStream(await ExportAsync(s)), ZipArchiveMode.Read);

        Assert.Equal(["dossier.json", "index.html", "summary.pdf", "pictures/1.svg", "pictures/2.svg", s.AttachmentPath, "manifest.json"],
            archive.Entries.Select(e => e.FullName).ToArray());
        Assert.All(archive.Entries, e => Assert.Equal(new DateTime(1980, 1, 1), e.LastWriteTime.DateTime));
    }

    [Fact]
    public async Task Manifest_lists_every_other_file_with_its_hash_and_the_chain_head()
    {
        var s = SampleCase.Build();
        var files = Entries(await ExportAsync(s));

        var manifest = DossierJson.Deserialize<DossierManifest>(files["manifest.json"]);

        Assert.Equal(files.Keys.Where(k => k != "manifest.json").Order(StringComparer.Ordinal), manifest.Files.Select(f => f.Path));
        Assert.Equal(s.Case.Timeline[^1].Hash, manifest.ChainHead);
        Assert.Equal(SampleCase.AttachmentBytes, files[s.AttachmentPath]);
    }

    [Fact]
    public async Task Export_then_verify_is_valid()
    {
        var zip = await ExportAsync(SampleCase.Build());

        var v = await DossierArchive.VerifyAsync(new MemoryStream(zip), DossierFiles.Trusted);

        Assert.True(v.Valid, string.Join("\n", v.Problems));
    }

    [Fact]
    public async Task Index_html_is_self_contained_escaped_and_shows_stale_marks_and_drift()
    {
        var html = Encoding.UTF8.GetString(Entries(await ExportAsync(SampleCase.Build()))["index.html"]);

        Assert.DoesNotContain("<script", html, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("Bram Oster &lt;b&gt;", html);
        Assert.Contains("<strong>delays</strong>", html);
        Assert.Contains("STALE since", html);
        Assert.Contains("CONCERN", html);
        Assert.Contains("data:image/svg+xml;base64,", html);
        Assert.Contains("Arrival delays", html);
        Assert.DoesNotContain("http://", html.Replace("http://www.w3.org", string.Empty).Replace("https://logbook.example.org", string.Empty));
    }

    [Fact]
    public async Task Missing_or_altered_attachment_in_the_store_refuses_the_export()
    {
        var s = SampleCase.Build();
        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);

        await Assert.ThrowsAsync<FileNotFoundException>(() => DossierExporter.ExportAsync(doc, _ => null, new MemoryStream()));
        await Assert.ThrowsAsync<InvalidDataException>(() => DossierExporter.ExportAsync(doc, _ => new MemoryStream([1, 2, 3]), new MemoryStream()));
    }
}
