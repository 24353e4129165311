using EventReview.Core.Checklists;

namespace EventReview.Core.Tests.Checklists;

public class ChecklistTemplateValidationTests
{
    private const string Good = """
        title: Small review
        description: Two items.
        version: 2
        sections:
          - key: first
            title: First
            items:
              - key: first.a
                title: Item A
                guidance: Look at **A**.
                check: timing
                signoffs: 2
                ownerMaySign: true
                dueDays: 5
              - key: first.b
                title: Item B
                guidance: Look at B.
        """;

    /// <summary>The good template with one item's extra lines replaced (item first.b).</summary>
    private static string WithItemB(string lines) => Good.Replace("        guidance: Look at B.", lines, StringComparison.Ordinal);

    [Fact]
    public void A_well_formed_template_is_parsed_with_every_field()
    {
        var t = ChecklistTemplateLoader.Parse(Good, "small");

        Assert.Equal("small", t.Name);
        Assert.Equal("Small review", t.Title);
        Assert.Equal(2, t.Version);
        var a = t.Sections[0].Items[0];
        Assert.Equal(("first.a", "Item A", "timing", 2, true, (int?)5), (a.Key, a.Title, a.Check, a.Signoffs, a.OwnerMaySign, a.DueDays));
        var b = t.Sections[0].Items[1];
        Assert.Equal((1, false, (string?)null, (int?)null), (b.Signoffs, b.OwnerMaySign, b.Check, b.DueDays));
    }

    public static TheoryData<string, string> BrokenItems() => new()
    {
        { "        guidance: Look at B.\n      - key: first.a\n        title: Again\n        guidance: Dup.", "item 'first.a' in section 'first': the key is used twice" },
        { "        guidance: Look at B.\n        check: astrology", "item 'first.b' in section 'first': unknown check 'astrology'" },
        { "        guidance: Look at B.\n        signoffs: 0", "item 'first.b' in section 'first': signoffs must be between 1 and 5" },
        { "        guidance: Look at B.\n        signoffs: 6", "item 'first.b' in section 'first': signoffs must be between 1 and 5" },
        { "        guidance: Look at B.\n        dueDays: 400", "item 'first.b' in section 'first': dueDays must be between 0 and 365" },
        { "        guidance: Look at B.\n        dueDays: -1", "item 'first.b' in section 'first': dueDays must be between 0 and 365" },
        { "        guidance: '  '", "item 'first.b' in section 'first': needs a title and guidance" },
    };

    [Theory]
    [MemberData(nameof(BrokenItems))]
    public void A_broken_item_is_rejected_with_a_message_naming_the_template_and_the_item(string lines, string expected)
    {
        var ex = Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse(WithItemB(lines), "small"));

        Assert.StartsWith("small: ", ex.Message, StringComparison.Ordinal);
        Assert.Contains(expected, ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("First.B")]
    [InlineData("first b")]
    [InlineData("-first")]
    [InlineData("first/b")]
    public void A_malformed_item_key_is_rejected_and_named(string key)
    {
        var yaml = Good.Replace("key: first.b", $"key: '{key}'", StringComparison.Ordinal);

        var ex = Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse(yaml, "small"));

        Assert.Contains($"item '{key}'", ex.Message, StringComparison.Ordinal);
        Assert.Contains("lower-case letters", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void An_item_key_of_65_characters_is_rejected()
    {
        var key = "k" + new string('x', 64);
        var yaml = Good.Replace("key: first.b", $"key: {key}", StringComparison.Ordinal);

        Assert.Contains(key, Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse(yaml, "small")).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_missing_title_is_rejected()
    {
        var ex = Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse(Good.Replace("title: Small review\n", "", StringComparison.Ordinal), "small"));

        Assert.Equal("small: 'title' is missing.", ex.Message);
    }

    [Fact]
    public void A_template_without_sections_is_rejected()
    {
        Assert.Equal("small: there are no sections.",
            Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse("title: T\nsections: []\n", "small")).Message);
    }

    [Fact]
    public void A_section_without_items_is_rejected_and_named()
    {
        var yaml = "title: T\nsections:\n  - key: lonely\n    title: Lonely\n    items: []\n";

        Assert.Contains("section 'lonely'", Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse(yaml, "small")).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_repeated_section_key_is_rejected_and_named()
    {
        var section = "  - key: twice\n    title: S\n    items:\n      - key: k{0}\n        title: T\n        guidance: G\n";
        var yaml = "title: T\nsections:\n" + string.Format(System.Globalization.CultureInfo.InvariantCulture, section, 1) + string.Format(System.Globalization.CultureInfo.InvariantCulture, section, 2);

        Assert.Contains("section key 'twice'", Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse(yaml, "small")).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void An_unknown_yaml_key_is_rejected_with_its_line()
    {
        var yaml = WithItemB("        guidance: Look at B.\n        signers: 2");

        var ex = Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse(yaml, "small"));

        Assert.Contains("small: YAML error at line 18,", ex.Message, StringComparison.Ordinal);
        Assert.Contains("signers", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Malformed_yaml_is_rejected_with_its_line()
    {
        var ex = Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse("title: T\nsections:\n  - key: [unclosed\n", "small"));

        Assert.Contains("YAML error at line", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_wrongly_typed_value_is_rejected_rather_than_guessed()
    {
        var yaml = WithItemB("        guidance: Look at B.\n        signoffs: two");

        Assert.Contains("YAML error", Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse(yaml, "small")).Message, StringComparison.Ordinal);
    }

    [Fact]
    public void An_empty_file_is_rejected()
    {
        Assert.Equal("small: the file is empty.", Assert.Throws<TemplateException>(() => ChecklistTemplateLoader.Parse("", "small")).Message);
    }
}
