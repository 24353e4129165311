using System.Text.Json;
using EventReview.Web.Services;

namespace EventReview.Web.Tests.Services;

public sealed class PrettyJsonTests
{
    [Fact]
    public void Objects_are_indented_series_stay_on_one_line_and_escapes_are_read_as_characters()
    {
        // What the record store writes: System.Text.Json escapes "+" as \u002B by default.
        var stored = JsonSerializer.Serialize(new { lag = "+5.92 ms", sigma = "≥ 3σ", series = new[] { 1.5, -2.0, 3.25 }, nested = new { ok = true } });
        Assert.Contains("\\u002B", stored, StringComparison.Ordinal);

        var pretty = PrettyJson.Format(stored);

        Assert.Equal("""
            {
              "lag": "+5.92 ms",
              "sigma": "≥ 3σ",
              "series": [1.5, -2, 3.25],
              "nested": {
                "ok": true
              }
            }
            """.ReplaceLineEndings("\n"), pretty);
    }

    [Fact]
    public void The_laid_out_text_reads_back_to_the_same_document_and_invalid_text_is_shown_as_it_is()
    {
        // Adversarial: quotes, backslashes and new lines inside strings must survive the layout.
        const string stored = "{\"a\":[{\"q\":\"say \\\"hi\\\"\\\\n\\n\"},[]],\"b\":{},\"c\":null}";

        var pretty = PrettyJson.Format(stored);

        Assert.True(JsonElement.DeepEquals(JsonDocument.Parse(stored).RootElement, JsonDocument.Parse(pretty).RootElement));
        Assert.Equal("{not json", PrettyJson.Format("{not json"));
    }
}
