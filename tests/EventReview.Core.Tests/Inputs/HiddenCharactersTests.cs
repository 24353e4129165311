using System.Text;
using EventReview.Core.Inputs;

namespace EventReview.Core.Tests.Inputs;

public class HiddenCharactersTests
{
    // Code points from the Unicode Character Database (from memory): bidirectional embeddings, overrides and isolates
    // (U+202A-U+202E, U+2066-U+2069), zero-width space/joiners, byte-order mark, soft hyphen, blank letters.
    public static TheoryData<int> Hidden() =>
    [
        0x202A, 0x202B, 0x202C, 0x202D, 0x202E, 0x2066, 0x2067, 0x2068, 0x2069, 0x200B, 0x200C, 0x200D, 0x200E, 0x200F,
        0xFEFF, 0x00AD, 0x2060, 0x061C, 0x115F, 0x1160, 0x3164, 0xFFA0, 0x2800, 0xFE0F, 0x034F, 0x0000, 0x0009, 0x007F,
        0x0085, 0x2028, 0x2029, 0xE0001, 0xE0100, 0xE000,
    ];

    [Theory]
    [MemberData(nameof(Hidden))]
    public void Each_invisible_or_reordering_character_is_found_and_named(int codePoint)
    {
        var text = "TC-" + new Rune(codePoint) + "0001";

        Assert.Equal($"U+{codePoint:X4}", HiddenCharacters.FirstIn(text));
    }

    [Theory]
    [InlineData("TC-0001")]
    [InlineData("ER-C 0142")]
    [InlineData("Kandidat-Ü_ø.ß")]
    [InlineData("候補-０１")]
    [InlineData("مرشح-12")]
    [InlineData("TC-😀")]
    public void Ordinary_visible_text_in_any_script_has_none(string text)
    {
        Assert.Null(HiddenCharacters.FirstIn(text));
    }

    [Fact]
    public void A_lone_surrogate_is_hidden()
    {
        Assert.Equal("U+D800", HiddenCharacters.FirstIn("TC-\uD800"));
        Assert.Equal("U+DC00", HiddenCharacters.FirstIn("\uDC00TC"));
    }

    [Fact]
    public void The_position_of_the_first_hidden_character_is_given_so_a_reader_can_find_it()
    {
        Assert.Equal((0x202E, 4), HiddenCharacters.Find("TC-\u202Eexe.1"));
        Assert.Equal((0x200B, 6), HiddenCharacters.Find("😀TC-\u200B")); // the emoji is two UTF-16 units
        Assert.Equal((-1, -1), HiddenCharacters.Find("TC-0001"));
    }
}
