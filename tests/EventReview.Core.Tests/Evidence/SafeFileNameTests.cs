using EventReview.Core.Evidence;

namespace EventReview.Core.Tests.Evidence;

public sealed class SafeFileNameTests
{
    [Theory]
    [InlineData("../../etc/passwd", "passwd")]
    [InlineData("..\\..\\Windows\\win.ini", "win.ini")]
    [InlineData("C:\\data\\plot.png", "plot.png")]
    [InlineData("plot\u0000\u0007.png\r\n", "plot.png")]
    [InlineData("report\u202Efdp.exe", "reportfdp.exe")]
    [InlineData("  .hidden. ", "hidden")]
    [InlineData("..", "attachment")]
    [InlineData("", "attachment")]
    [InlineData(null, "attachment")]
    [InlineData("<img src=x onerror=alert(1)>.png", "<img src=x onerror=alert(1)>.png")] // kept as text; shown encoded
    public void A_name_loses_its_path_and_invisible_characters(string? name, string expected) =>
        Assert.Equal(expected, SafeFileName.From(name));

    [Fact]
    public void A_long_name_is_cut_keeping_its_extension()
    {
        var name = SafeFileName.From(new string('a', 500) + ".csv");

        Assert.Equal(SafeFileName.MaxLength, name.Length);
        Assert.EndsWith(".csv", name, StringComparison.Ordinal);
    }

    [Fact]
    public void An_attachment_keeps_only_the_cleaned_name()
    {
        var item = EvidenceItem.Attachment("a/b\\..\\c\u0001.txt", "text/plain", 3, new string('a', 64), "d", new EventReview.Core.Cases.Actor("u", "U"), DateTimeOffset.UnixEpoch);

        Assert.Equal("c.txt", item.FileName);
    }
}
