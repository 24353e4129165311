using EventReview.Core.Configuration;

namespace EventReview.Core.Tests.Configuration;

public class ConfigurationImportTests
{
    [Fact]
    public void Key_value_lines_skip_comments_and_blanks_trim_and_sort_ordinally()
    {
        var items = ConfigurationImport.Parse("# header\n\nzeta = 1\n  Alpha=two words = x \n\tbeta:b/c-d_e = \n", "kx.conf");

        Assert.Equal(["Alpha", "beta:b/c-d_e", "zeta"], items.Keys.ToArray());
        Assert.Equal("two words = x", items["Alpha"]);
        Assert.Equal(string.Empty, items["beta:b/c-d_e"]);
    }

    [Fact]
    public void A_repeated_key_is_rejected_naming_both_lines()
    {
        var ex = Assert.Throws<FormatException>(() => ConfigurationImport.Parse("a = 1\n# c\nb = 2\na = 3\n", "kx.conf"));

        Assert.Contains("kx.conf, line 4", ex.Message);
        Assert.Contains("already appears on line 1", ex.Message);
    }

    [Fact]
    public void A_line_without_equals_sign_is_rejected_naming_the_line()
    {
        var ex = Assert.Throws<FormatException>(() => ConfigurationImport.Parse("a = 1\njust text\n", "kx.conf"));

        Assert.Contains("line 2", ex.Message);
        Assert.Contains("no '='", ex.Message);
    }

    [Theory]
    [InlineData("bad key = 1")]
    [InlineData("a\"b = 1")]
    [InlineData(" = 1")]
    public void Keys_outside_the_allowed_characters_are_rejected(string line)
    {
        var ex = Assert.Throws<FormatException>(() => ConfigurationImport.Parse("ok = 1\n" + line, "f"));
        Assert.Contains("line 2", ex.Message);
    }

    [Fact]
    public void Too_long_keys_and_values_are_rejected()
    {
        Assert.Contains("longer than 200", Assert.Throws<FormatException>(() => ConfigurationImport.Parse(new string('k', 201) + " = 1", "f")).Message);
        Assert.Contains("longer than 10000", Assert.Throws<FormatException>(() => ConfigurationImport.Parse("k = " + new string('v', 10_001), "f")).Message);
        Assert.Equal(10_000, ConfigurationImport.Parse("k = " + new string('v', 10_000), "f")["k"].Length);
    }

    [Fact]
    public void More_than_the_key_limit_is_rejected()
    {
        var text = string.Join('\n', Enumerable.Range(0, ConfigurationImport.MaxKeys + 1).Select(i => $"k{i} = {i}"));

        var ex = Assert.Throws<FormatException>(() => ConfigurationImport.Parse(text, "big"));

        Assert.Contains($"line {ConfigurationImport.MaxKeys + 1}", ex.Message);
    }

    [Fact]
    public void Json_objects_are_flattened_with_dots_and_indices_keeping_number_text()
    {
        var items = ConfigurationImport.Parse("  {\"daq\": {\"firmware\": \"4.2\", \"gain\": 1.50, \"big\": 1e400},\n \"chan\": [\"A\", {\"b\": true}], \"n\": null, \"e\": {}, \"z\": []}", "c.json");

        Assert.Equal(["chan[0]", "chan[1].b", "daq.big", "daq.firmware", "daq.gain", "n"], items.Keys.ToArray());
        Assert.Equal("1.50", items["daq.gain"]);
        Assert.Equal("1e400", items["daq.big"]);
        Assert.Equal("true", items["chan[1].b"]);
        Assert.Equal("null", items["n"]);
    }

    [Theory]
    [InlineData("{\n\"a\": 1,\n\"b\": NaN\n}", "line 3")]
    [InlineData("{\n\"a\": Infinity}", "line 2")]
    [InlineData("{\"a\": 1,\n\n\"b\": ", "line 3")]
    [InlineData("{\"a\": 1} trailing", "line 1")]
    public void Invalid_json_and_non_finite_numbers_are_rejected_naming_the_line(string text, string line)
    {
        var ex = Assert.Throws<FormatException>(() => ConfigurationImport.Parse(text, "c.json"));

        Assert.Contains("c.json, " + line, ex.Message);
    }

    [Fact]
    public void Json_keys_that_collide_after_flattening_are_rejected()
    {
        var ex = Assert.Throws<FormatException>(() => ConfigurationImport.Parse("{\"a.b\": 1,\n \"a\": {\"b\": 2}}", "c.json"));

        Assert.Contains("line 2", ex.Message);
        Assert.Contains("twice", ex.Message);
    }

    [Fact]
    public void Json_keys_with_spaces_are_rejected()
    {
        Assert.Throws<FormatException>(() => ConfigurationImport.Parse("{\"a b\": 1}", "c.json"));
    }
}
