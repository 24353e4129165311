using System.IO.Compression;
using System.Text.Json;
using EventReview.Cli.Commands;
using EventReview.Core.Dossier;
using EventReview.Dossier;

namespace EventReview.Cli.Tests.Commands;

[Collection("Console")]
public class DossierCommandTests
{
    private static string ExportZip()
    {
        var s = SampleCase.Build();
        var doc = DossierBuilder.Build(s.Case, s.Sites, s.Snapshots);
        var path = Path.Combine(Path.GetTempPath(), "er-dossier-" + Guid.NewGuid().ToString("N") + ".zip");
        using (var file = File.Create(path))
        {
            DossierExporter.ExportAsync(doc, sha => sha == s.AttachmentSha256 ? new MemoryStream(SampleCase.AttachmentBytes) : null, file, TestSigner.Instance).GetAwaiter().GetResult();
        }

        return path;
    }

    /// <summary>The signing key's public part as a PEM file (what the Integrity page shows).</summary>
    private static string KeyFile()
    {
        var path = Path.Combine(Path.GetTempPath(), "er-key-" + Guid.NewGuid().ToString("N") + ".pem");
        File.WriteAllText(path, TestSigner.Instance.Public.Pem());
        return path;
    }

    [Fact]
    public void Verify_without_a_trusted_key_reports_unsigned_and_exits_1()
    {
        var (code, output, _) = CliRunner.Run(DossierCommand.Build(), "dossier", "verify", ExportZip(), "--key", OtherKeyFile());

        Assert.Equal(1, code);
        Assert.StartsWith("unsigned: signed by key ", output.Trim());
        Assert.Contains("which is not one of the 1 trusted key(s)", output);
    }

    private static string OtherKeyFile()
    {
        var path = Path.Combine(Path.GetTempPath(), "er-key-" + Guid.NewGuid().ToString("N") + ".pem");
        File.WriteAllText(path, TestSigner.Other().Public.Pem());
        return path;
    }

    [Fact]
    public void Verify_with_a_file_that_is_not_a_key_exits_2()
    {
        var notKey = CliRunner.TempFile("hello", ".pem");

        var (code, _, error) = CliRunner.Run(DossierCommand.Build(), "dossier", "verify", ExportZip(), "--key", notKey);

        Assert.Equal(2, code);
        Assert.Contains("is not a record public key", error);
    }

    [Fact]
    public void Verify_of_a_fresh_export_prints_valid_and_exits_0()
    {
        var path = ExportZip();

        var (code, output, _) = CliRunner.Run(DossierCommand.Build(), "dossier", "verify", path, "--key", KeyFile());

        Assert.Equal(0, code);
        Assert.StartsWith("valid (signed by the trusted key ", output.Trim());
    }

    [Fact]
    public void Verify_of_an_altered_picture_prints_the_problem_and_exits_1_with_json()
    {
        var path = ExportZip();
        using (var zip = ZipFile.Open(path, ZipArchiveMode.Update))
        {
            zip.GetEntry("pictures/1.svg")!.Delete();
            using var s = zip.CreateEntry("pictures/1.svg").Open();
            s.Write("<svg xmlns=\"http://www.w3.org/2000/svg\"/>"u8);
        }

        var (code, output, _) = CliRunner.Run(DossierCommand.Build(), "dossier", "verify", path, "--json", "--key", KeyFile());

        Assert.Equal(1, code);
        using var doc = JsonDocument.Parse(output);
        Assert.False(doc.RootElement.GetProperty("valid").GetBoolean());
        Assert.Equal("invalid", doc.RootElement.GetProperty("status").GetString());
        var p = doc.RootElement.GetProperty("problems").EnumerateArray().First();
        Assert.Equal("pictures/1.svg", p.GetProperty("file").GetString());
        Assert.Contains("altered", p.GetProperty("what").GetString());
        // The page embeds the picture: re-rendered from the altered one, it no longer matches index.html either.
        Assert.Contains(doc.RootElement.GetProperty("problems").EnumerateArray(), x => x.GetProperty("file").GetString() == "index.html");
    }

    [Fact]
    public void Verify_of_a_truncated_file_exits_1_with_a_clear_line()
    {
        var path = ExportZip();
        var bytes = File.ReadAllBytes(path);
        File.WriteAllBytes(path, bytes[..100]);

        var (code, output, _) = CliRunner.Run(DossierCommand.Build(), "dossier", "verify", path);

        Assert.Equal(1, code);
        Assert.StartsWith("(zip): not a readable ZIP", output.Trim());
    }

    [Fact]
    public void Verify_of_a_missing_file_exits_2()
    {
        var (code, _, error) = CliRunner.Run(DossierCommand.Build(), "dossier", "verify", "/nonexistent/x.zip");

        Assert.Equal(2, code);
        Assert.Contains("not found", error);
    }
}
