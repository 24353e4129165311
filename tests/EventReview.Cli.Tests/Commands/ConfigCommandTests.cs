using System.Text.Json;
using EventReview.Cli.Commands;

namespace EventReview.Cli.Tests.Commands;

[Collection("Console")]
public class ConfigCommandTests
{
    [Fact]
    public void Diff_as_json_lists_added_removed_changed_and_unchanged()
    {
        var frozen = CliRunner.TempFile("# frozen\ndaq.firmware = 4.2.1\ncalibration.version = v17\nseal.rack3 = S-1\n", ".conf");
        var later = CliRunner.TempFile("{\"daq\": {\"firmware\": \"4.2.2\"}, \"calibration\": {\"version\": \"v17\"}, \"filters\": [\"a\"]}", ".json");

        var (code, output, _) = CliRunner.Run(ConfigCommand.Build(), "config", "diff", "--frozen", frozen, "--snapshot", later, "--json");

        Assert.Equal(1, code);
        using var doc = JsonDocument.Parse(output);
        var root = doc.RootElement;
        Assert.Equal("filters[0]", root.GetProperty("added")[0].GetProperty("key").GetString());
        Assert.Equal("seal.rack3", root.GetProperty("removed")[0].GetProperty("key").GetString());
        var changed = root.GetProperty("changed")[0];
        Assert.Equal("daq.firmware", changed.GetProperty("key").GetString());
        Assert.Equal("4.2.1", changed.GetProperty("old").GetString());
        Assert.Equal("4.2.2", changed.GetProperty("new").GetString());
        Assert.Equal(1, root.GetProperty("unchanged").GetInt32());
        Assert.Equal("drift", root.GetProperty("verdict").GetString());
        Assert.Contains("freeze period not known", root.GetProperty("reason").GetString());
    }

    [Fact]
    public void Diff_inside_a_given_freeze_period_is_a_concern_as_in_the_app()
    {
        var frozen = CliRunner.TempFile("daq.firmware = 4.2.1\n", ".conf");
        var later = CliRunner.TempFile("daq.firmware = 4.2.2\n", ".conf");
        string[] args = ["config", "diff", "--frozen", frozen, "--snapshot", later, "--freeze-from", "2026-12-01T00:00:00Z", "--freeze-until", "2026-12-15T00:00:00Z", "--json"];

        var (code, output, _) = CliRunner.Run(ConfigCommand.Build(), [.. args, "--captured-at", "2026-12-03T10:00:00Z"]);
        Assert.Equal(1, code);
        using (var doc = JsonDocument.Parse(output))
        {
            Assert.Equal("concern", doc.RootElement.GetProperty("verdict").GetString());
        }

        var (_, outside, _) = CliRunner.Run(ConfigCommand.Build(), [.. args, "--captured-at", "2026-12-20T10:00:00Z"]);
        using (var doc = JsonDocument.Parse(outside))
        {
            Assert.Equal("drift", doc.RootElement.GetProperty("verdict").GetString());
        }

        var (bad, _, err) = CliRunner.Run(ConfigCommand.Build(), [.. args, "--captured-at", "yesterday"]);
        Assert.Equal(2, bad);
        Assert.Contains("--captured-at", err);
    }

    [Fact]
    public void Diff_of_equal_files_exits_0_with_a_count_line()
    {
        var a = CliRunner.TempFile("x = 1\n", ".conf");
        var b = CliRunner.TempFile("{\"x\": \"1\"}", ".json");

        var (code, output, _) = CliRunner.Run(ConfigCommand.Build(), "config", "diff", "--frozen", a, "--snapshot", b);

        Assert.Equal(0, code);
        var lines = output.Trim().Split('\n');
        Assert.Equal("0 added, 0 removed, 0 changed, 1 unchanged", lines[0]);
        Assert.StartsWith("verdict: no drift", lines[1], StringComparison.Ordinal);
    }

    [Fact]
    public void Diff_with_nan_in_json_exits_2_naming_the_line()
    {
        var a = CliRunner.TempFile("x = 1\n", ".conf");
        var b = CliRunner.TempFile("{\n\"x\": NaN\n}", ".json");

        var (code, _, error) = CliRunner.Run(ConfigCommand.Build(), "config", "diff", "--frozen", a, "--snapshot", b);

        Assert.Equal(2, code);
        Assert.Contains("line 2", error);
    }
}
