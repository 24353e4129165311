using System.Text.Json;
using EventReview.Cli.Commands;

namespace EventReview.Cli.Tests.Commands;

[Collection("Console")]
public sealed class NetworkCommandTests : IDisposable
{
    // An invented two-site network (made up for this test; no real site).
    private const string TwoSites = """
        {
          "name": "test network",
          "sites": [
            { "code": "QA", "name": "Quarry A", "latitudeDegrees": 12.5, "longitudeDegrees": -40.25, "heightMeters": 120,
              "xArmAzimuthDegrees": 10, "yArmAzimuthDegrees": 100, "timingUncertaintySeconds": 0.0005 },
            { "code": "QB", "name": "Quarry B", "latitudeDegrees": -20, "longitudeDegrees": 75.5, "heightMeters": 15,
              "xArmAzimuthDegrees": 200, "yArmAzimuthDegrees": 290, "timingUncertaintySeconds": 0.001 }
          ]
        }
        """;

    private readonly string _dir = Path.Combine(Path.GetTempPath(), "er-cli-network-" + Guid.NewGuid().ToString("N"));

    public void Dispose()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        try
        {
            Directory.Delete(_dir, recursive: true);
        }
        catch (IOException)
        {
        }
    }

    [Fact]
    public void An_imported_network_exports_again_field_for_field()
    {
        var file = CliRunner.TempFile(TwoSites, ".json");

        var (exit, output, _) = CliRunner.Run(NetworkCommand.Build(), "network", "import", "--file", file, "--data", _dir);
        var (exportExit, exported, _) = CliRunner.Run(NetworkCommand.Build(), "network", "export", "--data", _dir);

        Assert.Equal(0, exit);
        Assert.Contains("2 site(s): QA, QB", output, StringComparison.Ordinal);
        Assert.Equal(0, exportExit);
        Assert.True(JsonElement.DeepEquals(JsonDocument.Parse(TwoSites).RootElement, JsonDocument.Parse(exported).RootElement), exported);
    }

    [Theory]
    [InlineData("\"latitudeDegrees\": -20", "\"latitudeDegrees\": -95", "sites[1].latitudeDegrees")]
    [InlineData("\"code\": \"QB\"", "\"code\": \"QA\"", "sites[1].code")]
    [InlineData("\"timingUncertaintySeconds\": 0.001 }", "\"timingUncertaintySeconds\": \"fast\" }", "not valid JSON")]
    [InlineData("\"name\": \"test network\",", "", "name")]
    public void A_malformed_file_names_the_file_and_field_and_changes_nothing(string from, string to, string field)
    {
        // Adversarial: the first site is valid, so a naive import that stored site by site would leave half a network.
        var good = CliRunner.TempFile(TwoSites, ".json");
        Assert.Equal(0, CliRunner.Run(NetworkCommand.Build(), "network", "import", "--file", good, "--data", _dir).Exit);
        var bad = CliRunner.TempFile(TwoSites.Replace(from, to, StringComparison.Ordinal).Replace("Quarry A", "Changed A", StringComparison.Ordinal), ".json");

        var (exit, _, error) = CliRunner.Run(NetworkCommand.Build(), "network", "import", "--file", bad, "--data", _dir);
        var (_, exported, _) = CliRunner.Run(NetworkCommand.Build(), "network", "export", "--data", _dir);

        Assert.Equal(2, exit);
        Assert.Contains(bad, error, StringComparison.Ordinal);
        Assert.Contains(field, error, StringComparison.Ordinal);
        Assert.Contains("Nothing was changed", error, StringComparison.Ordinal);
        Assert.True(JsonElement.DeepEquals(JsonDocument.Parse(TwoSites).RootElement, JsonDocument.Parse(exported).RootElement), exported);
    }

    [Fact]
    public void A_missing_file_is_named()
    {
        var missing = Path.Combine(_dir, "nowhere", "network.json");

        var (exit, _, error) = CliRunner.Run(NetworkCommand.Build(), "network", "import", "--file", missing, "--data", _dir);

        Assert.Equal(2, exit);
        Assert.Contains(missing, error, StringComparison.Ordinal);
        Assert.Contains("no such", error, StringComparison.Ordinal);
    }

    [Fact]
    public void Exporting_before_any_import_says_what_to_do()
    {
        var (exit, _, error) = CliRunner.Run(NetworkCommand.Build(), "network", "export", "--data", _dir);

        Assert.Equal(2, exit);
        Assert.Contains("network import --file", error, StringComparison.Ordinal);
    }
}
