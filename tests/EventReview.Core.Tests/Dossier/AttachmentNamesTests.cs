using EventReview.Core.Dossier;

namespace EventReview.Core.Tests.Dossier;

public class AttachmentNamesTests
{
    private const string Sha = "0123456789abcdef0123456789abcdef0123456789abcdef0123456789abcdef";

    [Theory]
    [InlineData("delays.csv", "delays.csv")]
    [InlineData("Strain KX 2026.TXT", "Strain_KX_2026.txt")]
    [InlineData("../../etc/passwd", "passwd")]
    [InlineData("..\\..\\windows\\system32\\config.sys", "config.sys")]
    [InlineData("/absolute/path/notes.md", "notes.md")]
    [InlineData("..", "attachment")]
    [InlineData("...", "attachment")]
    [InlineData("", "attachment")]
    [InlineData(null, "attachment")]
    [InlineData(".bashrc", "bashrc")]
    [InlineData("README", "README")]
    [InlineData("CON", "CON")]
    [InlineData("nul.txt", "nul.txt")]
    [InlineData("Zeitreihe für Gerät ③.csv", "Zeitreihe_f_r_Ger_t_3.csv")]
    [InlineData("日本語.pdf", "attachment.pdf")]
    [InlineData("archive.tar.gz", "archive.tar.gz")]
    [InlineData("weird.ex~e", "weird.ex_e")]
    [InlineData("name.with.a.very-long-extension-part", "name.with.a.very-long-extension-part")]
    [InlineData("a\u0000b\u202Ec.txt", "a_b_c.txt")]
    [InlineData("  spaced  .csv", "spaced.csv")]
    public void Names_keep_only_safe_ascii_and_their_extension(string? name, string expected)
    {
        Assert.Equal(expected, AttachmentNames.Safe(name));
        var path = AttachmentNames.PathOf(Sha, name);
        Assert.Equal("attachments/0123456789abcdef-" + expected, path);
        Assert.Matches("^attachments/[0-9a-f]{16}-[A-Za-z0-9][A-Za-z0-9._-]*$", path);
        Assert.DoesNotContain("..", path[12..]);
    }

    [Fact]
    public void A_very_long_name_is_cut_but_keeps_its_extension()
    {
        var safe = AttachmentNames.Safe(new string('x', 500) + ".csv");
        Assert.Equal(new string('x', AttachmentNames.MaxBaseLength) + ".csv", safe);
        Assert.True(AttachmentNames.PathOf(Sha, new string('é', 10_000)).Length < 100);
    }

    [Fact]
    public void A_reserved_device_name_is_never_the_whole_file_name_because_the_hash_comes_first()
    {
        foreach (var reserved in new[] { "CON", "PRN", "AUX", "NUL", "COM1", "LPT9" })
        {
            var file = AttachmentNames.PathOf(Sha, reserved + ".txt")["attachments/".Length..];
            Assert.StartsWith("0123456789abcdef-", file);
        }
    }

    [Fact]
    public void A_hash_that_is_not_hex_is_refused()
    {
        Assert.Throws<ArgumentException>(() => AttachmentNames.PathOf("../../etc/passwd/0000000000", "a.txt"));
        Assert.Throws<ArgumentException>(() => AttachmentNames.PathOf("abc", "a.txt"));
    }
}
