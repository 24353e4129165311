using System.IO.Compression;
using System.Text;

namespace EventReview.Dossier.Tests;

public class DossierArchiveTests
{
    [Fact]
    public async Task A_truncated_zip_is_a_clear_problem_not_an_exception()
    {
        var zip = await DossierExporterTests.ExportAsync(SampleCase.Build());

        var v = await DossierArchive.VerifyAsync(new MemoryStream(zip[..(zip.Length / 2)]), DossierFiles.Trusted);

        Assert.False(v.Valid);
        Assert.Contains("not a readable ZIP", Assert.Single(v.Problems).What);
    }

    [Fact]
    public async Task Garbage_is_a_clear_problem()
    {
        var v = await DossierArchive.VerifyAsync(new MemoryStream(Encoding.UTF8.GetBytes("this is not a zip")), DossierFiles.Trusted);

        Assert.False(v.Valid);
        Assert.Equal(DossierArchive.ZipName, v.Problems[0].File);
    }

    [Fact]
    public async Task An_entry_with_a_parent_path_is_refused_and_not_read()
    {
        var zip = await DossierExporterTests.ExportAsync(SampleCase.Build());
        var ms = new MemoryStream();
        ms.Write(zip);
        using (var archive = new ZipArchive(ms, ZipArchiveMode.Update, leaveOpen: true))
        {
            using var s = archive.CreateEntry("../evil.sh").Open();
            s.Write("rm -rf /"u8);
        }

        ms.Position = 0;
        var v = await DossierArchive.VerifyAsync(ms, DossierFiles.Trusted);

        Assert.False(v.Valid);
        var p = Assert.Single(v.Problems);
        Assert.Equal("../evil.sh", p.File);
        Assert.Contains("unsafe entry name", p.What);
    }

    [Theory]
    [InlineData("../x", false)]
    [InlineData("a/../../x", false)]
    [InlineData("/etc/passwd", false)]
    [InlineData("a\\b", false)]
    [InlineData("C:/x", false)]
    [InlineData("pictures/1.svg", true)]
    public void Entry_names_are_checked(string name, bool safe) => Assert.Equal(safe, DossierArchive.IsSafe(name));

    [Fact]
    public async Task A_corrupted_byte_is_caught()
    {
        var s = SampleCase.Build();
        var zip = await DossierExporterTests.ExportAsync(s);
        var found = 0;
        // Flip one byte at many positions: every flip must give at least one problem (CRC, hash, structure) and never throw.
        for (var at = 30; at < zip.Length; at += Math.Max(1, zip.Length / 40))
        {
            var bad = (byte[])zip.Clone();
            bad[at] ^= 0x5A;
            var v = await DossierArchive.VerifyAsync(new MemoryStream(bad), DossierFiles.Trusted);
            if (!v.Valid)
            {
                found++;
                Assert.NotEmpty(v.Problems);
            }
        }

        // Bytes inside the deflated data of a stored file always fail; a flip in a header's unused field may not.
        Assert.True(found >= 30, $"only {found} of the corrupted copies were caught");
    }

    [Fact]
    public async Task A_corrupted_byte_in_the_dossier_data_names_the_entry()
    {
        var zip = await DossierExporterTests.ExportAsync(SampleCase.Build());
        // The first entry's data starts after its 30-byte local header and its name ("dossier.json").
        var bad = (byte[])zip.Clone();
        bad[30 + "dossier.json".Length + 100] ^= 0xFF;

        var v = await DossierArchive.VerifyAsync(new MemoryStream(bad), DossierFiles.Trusted);

        Assert.False(v.Valid);
        Assert.Contains(v.Problems, p => p.File == "dossier.json");
    }
}
