using System.CommandLine;
using System.Text.Json;
using EventReview.Cli.Commands;

namespace EventReview.Cli.Tests.Commands;

[CollectionDefinition("Console", DisableParallelization = true)]
public class ConsoleCollection;

[Collection("Console")]
public sealed class TimingCommandTests : IDisposable
{
    private readonly string _network = Path.Combine(Path.GetTempPath(), $"network-{Guid.NewGuid():N}.json");

    public TimingCommandTests()
    {
        File.WriteAllText(_network, """
            {"name": "Invented test network", "sites": [
              {"code": "KX", "name": "Site KX", "latitudeDegrees": 44, "longitudeDegrees": -101, "heightMeters": 100,
               "xArmAzimuthDegrees": 62, "yArmAzimuthDegrees": 152, "timingUncertaintySeconds": 0.0001},
              {"code": "MV", "name": "Site MV", "latitudeDegrees": 19, "longitudeDegrees": -71, "heightMeters": 0,
               "xArmAzimuthDegrees": 117, "yArmAzimuthDegrees": 207, "timingUncertaintySeconds": 0.0001},
              {"code": "TQ", "name": "Site TQ", "latitudeDegrees": -12, "longitudeDegrees": -52, "heightMeters": 400,
               "xArmAzimuthDegrees": 148, "yArmAzimuthDegrees": 238, "timingUncertaintySeconds": 0.0002}]}
            """);
    }

    public void Dispose() => File.Delete(_network);

    internal static (int ExitCode, string Out, string Error) Invoke(Command command, params string[] args)
    {
        var root = new RootCommand("test");
        root.Subcommands.Add(command);
        var (oldOut, oldError) = (Console.Out, Console.Error);
        using var output = new StringWriter();
        using var error = new StringWriter();
        Console.SetOut(output);
        Console.SetError(error);
        try
        {
            var code = root.Parse(args).Invoke();
            return (code, output.ToString(), error.ToString());
        }
        finally
        {
            Console.SetOut(oldOut);
            Console.SetError(oldError);
        }
    }

    [Fact]
    public void Timing_json_has_the_contract_shape()
    {
        var (code, output, _) = Invoke(TimingCommand.Build(), "timing", "--network", _network,
            "--arrival", "KX=1400000000.000", "--arrival", "MV=1400000000.005", "--arrival", "TQ=1400000000.012", "--json");

        Assert.Equal(0, code);
        using var doc = JsonDocument.Parse(output);
        var root = doc.RootElement;
        var pairs = root.GetProperty("pairs");
        Assert.Equal(3, pairs.GetArrayLength());
        var first = pairs[0];
        string[] keys = ["a", "b", "baselineMeters", "lightTravelSeconds", "allowedSeconds", "observedSeconds", "marginSeconds", "consistent", "ringAngleDegrees"];
        Assert.All(keys, k => Assert.True(first.TryGetProperty(k, out _), k));
        Assert.Equal("KX", first.GetProperty("a").GetString());
        Assert.Equal("MV", first.GetProperty("b").GetString());
        Assert.Equal(0.005, first.GetProperty("observedSeconds").GetDouble(), 1e-12);
        var sky = root.GetProperty("sky");
        Assert.Equal(2, sky.GetArrayLength());
        Assert.All(new[] { "raDegrees", "decDegrees", "residualSeconds" }, k => Assert.True(sky[0].TryGetProperty(k, out _), k));
        Assert.True(sky[0].GetProperty("residualSeconds").GetDouble() <= sky[1].GetProperty("residualSeconds").GetDouble());
        Assert.Equal("2024-05-17T16:53:02.000000Z", root.GetProperty("utc").GetString());
    }

    [Fact]
    public void Ring_angle_is_null_outside_the_light_travel_window()
    {
        var (code, output, _) = Invoke(TimingCommand.Build(), "timing", "--network", _network,
            "--arrival", "KX=1400000000.000", "--arrival", "MV=1400000000.030", "--json");

        Assert.Equal(1, code);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal(JsonValueKind.Null, doc.RootElement.GetProperty("pairs")[0].GetProperty("ringAngleDegrees").ValueKind);
    }

    [Fact]
    public void Unknown_site_code_exits_2_with_a_one_line_message()
    {
        var (code, output, error) = Invoke(TimingCommand.Build(), "timing", "--network", _network,
            "--arrival", "KX=1400000000.000", "--arrival", "ZZ=1400000000.005", "--json");

        Assert.Equal(2, code);
        Assert.Equal(string.Empty, output);
        Assert.Contains("ZZ", error);
        Assert.Single(error.Split('\n', StringSplitOptions.RemoveEmptyEntries));
    }

    [Fact]
    public void A_malformed_arrival_exits_2()
    {
        var (code, _, error) = Invoke(TimingCommand.Build(), "timing", "--network", _network, "--arrival", "KX:12", "--arrival", "MV=1");

        Assert.Equal(2, code);
        Assert.Contains("--arrival", error);
    }

    [Fact]
    public void Timing_json_of_four_sites_gives_the_verdict_and_the_chi_square_contract()
    {
        // Invented four-site network (letters-only codes); every delay of a real direction shrunk to 60 %: every pair passes, the
        // sky fit does not (see Core TimingChiSquareTests for the same case against the old RMS rule).
        var path = Path.Combine(Path.GetTempPath(), $"network4-{Guid.NewGuid():N}.json");
        File.WriteAllText(path, """
            {"name": "Four invented sites", "sites": [
              {"code": "PA", "name": "Pale Anchor", "latitudeDegrees": 52, "longitudeDegrees": 8, "heightMeters": 100, "xArmAzimuthDegrees": 10, "yArmAzimuthDegrees": 100, "timingUncertaintySeconds": 0.0005},
              {"code": "QB", "name": "Quiet Bay", "latitudeDegrees": -31, "longitudeDegrees": 118, "heightMeters": 20, "xArmAzimuthDegrees": 45, "yArmAzimuthDegrees": 135, "timingUncertaintySeconds": 0.0005},
              {"code": "RC", "name": "Red Cedar", "latitudeDegrees": 38, "longitudeDegrees": -98, "heightMeters": 400, "xArmAzimuthDegrees": 300, "yArmAzimuthDegrees": 30, "timingUncertaintySeconds": 0.0005},
              {"code": "SD", "name": "Salt Dune", "latitudeDegrees": 5, "longitudeDegrees": 30, "heightMeters": 600, "xArmAzimuthDegrees": 70, "yArmAzimuthDegrees": 160, "timingUncertaintySeconds": 0.0005}]}
            """);
        try
        {
            var net = Core.Network.NetworkFile.Read(path);
            var t0 = Core.Time.GpsTime.FromSeconds(1500000000m); // after the bundled table's expiry (2027-06-28): the warning must show
            var args = new List<string> { "timing", "--network", path, "--json" };
            foreach (var p in Core.Network.NetworkProjection.Project(net.Sites, Core.Time.SkyFrame.ToEcef(150, 20, 0), 0))
            {
                args.AddRange(["--arrival", $"{p.Code}={t0.AddSeconds(0.6 * p.DelaySeconds)}"]);
            }

            var (code, output, _) = Invoke(TimingCommand.Build(), [.. args]);

            Assert.Equal(1, code); // a negative result
            using var doc = JsonDocument.Parse(output);
            var root = doc.RootElement;
            Assert.Equal("inconsistent", root.GetProperty("verdict").GetString());
            Assert.Equal(1, root.GetProperty("degreesOfFreedom").GetInt32());
            Assert.True(root.GetProperty("chi2").GetDouble() > 14);
            Assert.True(root.GetProperty("pValue").GetDouble() < 2.7e-3);
            Assert.Equal("mean of date", root.GetProperty("skyFrame").GetString());
            Assert.All(root.GetProperty("pairs").EnumerateArray(), p => Assert.True(p.GetProperty("consistent").GetBoolean()));
            Assert.Contains(root.GetProperty("warnings").EnumerateArray(), w => w.GetString()!.Contains("leap-second table's expiry", StringComparison.Ordinal));
        }
        finally
        {
            File.Delete(path);
        }
    }

    [Fact]
    public void Timing_runs_the_antenna_response_test_when_asked_and_refuses_half_an_observation()
    {
        var (code, output, _) = Invoke(TimingCommand.Build(), "timing", "--network", _network,
            "--arrival", "KX=1400000000.000", "--arrival", "MV=1400000000.005", "--antenna-pair", "KX,MV", "--observed-sign", "-1", "--observed-ratio", "0.8", "--json");
        Assert.True(code is 0 or 1);
        using var doc = JsonDocument.Parse(output);
        Assert.Equal("KX", doc.RootElement.GetProperty("antenna").GetProperty("a").GetString());
        Assert.Contains("antenna response", doc.RootElement.GetProperty("reason").GetString());
        Assert.Equal(JsonValueKind.Null, doc.RootElement.GetProperty("chi2").ValueKind); // two sites: no sky fit

        var (bad, _, error) = Invoke(TimingCommand.Build(), "timing", "--network", _network,
            "--arrival", "KX=1400000000.000", "--arrival", "MV=1400000000.005", "--observed-sign", "-1");
        Assert.Equal(2, bad);
        Assert.Contains("--antenna-pair", error);
    }
}
