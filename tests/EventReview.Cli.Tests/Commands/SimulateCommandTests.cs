using System.Text.Json;
using EventReview.Cli.Commands;
using EventReview.Core.Network;
using EventReview.Core.Time;

namespace EventReview.Cli.Tests.Commands;

[Collection("Console")]
public sealed class SimulateCommandTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("er-cli-simulate-").FullName;
    private readonly string _network;

    public SimulateCommandTests()
    {
        _network = Path.Combine(_dir, "network.json");
        File.WriteAllText(_network, """
            {"name": "Invented test network", "sites": [
              {"code": "KX", "name": "Site KX", "latitudeDegrees": 44, "longitudeDegrees": -101, "heightMeters": 100,
               "xArmAzimuthDegrees": 62, "yArmAzimuthDegrees": 152, "timingUncertaintySeconds": 0.0001},
              {"code": "MV", "name": "Site MV", "latitudeDegrees": 19, "longitudeDegrees": -71, "heightMeters": 0,
               "xArmAzimuthDegrees": 117, "yArmAzimuthDegrees": 207, "timingUncertaintySeconds": 0.0001}]}
            """);
    }

    public void Dispose() => Directory.Delete(_dir, true);

    private (int Exit, string Out, string Err) Simulate(string outDir, params string[] extra) =>
        CliRunner.Run(SimulateCommand.Build(), ["simulate", "--network", _network, "--out", outDir, "--seed", "11", "--gps", "1300000000",
            "--duration-s", "8", "--sample-rate", "2048", "--snr", "60", "--chirp-mass", "20", "--inclination-deg", "90", .. extra]);

    [Fact]
    public void Simulate_writes_one_file_per_site_and_a_truth_record_that_matches_the_network_geometry()
    {
        var outDir = Path.Combine(_dir, "run1");
        var (exit, _, err) = Simulate(outDir);
        Assert.True(exit == 0, err);
        Assert.True(File.Exists(Path.Combine(outDir, "KX-strain.txt")));
        Assert.True(File.Exists(Path.Combine(outDir, "MV-strain.txt")));
        var truth = JsonDocument.Parse(File.ReadAllText(Path.Combine(outDir, "truth.json"))).RootElement;
        Assert.Equal(11, truth.GetProperty("seed").GetInt32());
        Assert.Equal(60, truth.GetProperty("networkSnr").GetDouble(), 1e-6); // the simulator scales the injection to the asked SNR
        var sites = truth.GetProperty("sites").EnumerateArray().ToList();
        Assert.Equal(["KX", "MV"], sites.Select(s => s.GetProperty("code").GetString()));

        // Identity: the delays follow from the recorded RA/Dec/psi/GMST through the network projection.
        var net = NetworkFile.Read(_network);
        var n = SkyFrame.ToEcef(truth.GetProperty("raDegrees").GetDouble(), truth.GetProperty("decDegrees").GetDouble(), truth.GetProperty("gmstDegrees").GetDouble());
        var expected = NetworkProjection.Project(net.Sites, n, truth.GetProperty("psiDegrees").GetDouble() * Math.PI / 180);
        for (int i = 0; i < 2; i++)
        {
            Assert.Equal(expected[i].DelaySeconds, sites[i].GetProperty("delaySeconds").GetDouble(), 1e-12);
            Assert.Equal(expected[i].FPlus, sites[i].GetProperty("fPlus").GetDouble(), 1e-12);
            Assert.True(GpsTime.TryParse(sites[i].GetProperty("arrivalGps").GetString(), out var arrival));
            Assert.Equal(expected[i].DelaySeconds, arrival.SecondsSince(GpsTime.FromSeconds(1300000000m)), 1e-9);
        }

        // The overlap verb finds the recorded lag and sign in the written files (network SNR 60, edge-on so the two sites'
        // waveforms differ only by a sign, not by a phase).
        double truthLag = sites[0].GetProperty("delaySeconds").GetDouble() - sites[1].GetProperty("delaySeconds").GetDouble();
        var (oexit, output, oerr) = CliRunner.Run(OverlapCommand.Build(), "overlap", "--a", Path.Combine(outDir, "KX-strain.txt"),
            "--b", Path.Combine(outDir, "MV-strain.txt"), "--center", "1300000000", "--psd-segment-s", "2", "--network", _network, "--site-a", "KX", "--site-b", "MV", "--json");
        Assert.True(oexit == 0, oerr);
        var o = JsonDocument.Parse(output).RootElement;
        Assert.True(Math.Abs(truthLag - o.GetProperty("lagSeconds").GetDouble()) <= 3 * o.GetProperty("lagUncertaintySeconds").GetDouble(), output); // within 3σ
        Assert.Equal(sites[1].GetProperty("signRelativeToFirst").GetInt32(), o.GetProperty("sign").GetInt32());
    }

    [Fact]
    public void Simulate_is_deterministic_for_a_seed_and_draws_another_sky_for_another_seed()
    {
        var a = Path.Combine(_dir, "a");
        var b = Path.Combine(_dir, "b");
        Assert.Equal(0, Simulate(a).Exit);
        Assert.Equal(0, Simulate(b).Exit);
        Assert.Equal(File.ReadAllText(Path.Combine(a, "KX-strain.txt")), File.ReadAllText(Path.Combine(b, "KX-strain.txt")));
        Assert.Equal(File.ReadAllText(Path.Combine(a, "truth.json")), File.ReadAllText(Path.Combine(b, "truth.json")));

        var c = Path.Combine(_dir, "c");
        var (exit, _, err) = CliRunner.Run(SimulateCommand.Build(), "simulate", "--network", _network, "--out", c, "--seed", "12",
            "--duration-s", "4", "--sample-rate", "1024");
        Assert.True(exit == 0, err);
        var ra11 = JsonDocument.Parse(File.ReadAllText(Path.Combine(a, "truth.json"))).RootElement.GetProperty("raDegrees").GetDouble();
        var truth12 = JsonDocument.Parse(File.ReadAllText(Path.Combine(c, "truth.json"))).RootElement;
        Assert.NotEqual(ra11, truth12.GetProperty("raDegrees").GetDouble());
        Assert.Equal(12, truth12.GetProperty("chirpMassMsun").GetDouble()); // the invented default (issue 16 item 5)
        Assert.Equal(JsonValueKind.Array, truth12.GetProperty("warnings").ValueKind);
        Assert.Contains(truth12.GetProperty("assumptions").EnumerateArray(), x => x.GetString()!.Contains("mean-of-date frame", StringComparison.Ordinal));
    }

    [Fact]
    public void Simulate_uses_a_given_sky_direction_and_polarisation()
    {
        var outDir = Path.Combine(_dir, "given");
        var (exit, output, err) = Simulate(outDir, "--ra", "120.5", "--dec", "-33", "--psi", "20", "--json");
        Assert.True(exit == 0, err);
        var truth = JsonDocument.Parse(output).RootElement;
        Assert.Equal(120.5, truth.GetProperty("raDegrees").GetDouble(), 1e-12);
        Assert.Equal(-33, truth.GetProperty("decDegrees").GetDouble(), 1e-12);
        Assert.Equal(20, truth.GetProperty("psiDegrees").GetDouble(), 1e-9);
    }

    [Theory]
    [InlineData("--chirp-mass", "0", "--chirp-mass")]
    [InlineData("--dec", "95", "--dec")]
    [InlineData("--ra", "360", "--ra")]
    [InlineData("--sample-rate", "0", "--sample-rate")]
    [InlineData("--gps", "yesterday", "--gps")]
    public void Simulate_refuses_bad_options_with_a_one_line_error(string option, string value, string named)
    {
        var (exit, _, err) = CliRunner.Run(SimulateCommand.Build(), "simulate", "--network", _network, "--out", Path.Combine(_dir, "bad"), "--seed", "3",
            "--duration-s", "4", option, value);
        Assert.Equal(2, exit);
        Assert.StartsWith("error: ", err);
        Assert.Contains(named, err);
        Assert.Single(err.Trim().Split('\n'));
        Assert.False(File.Exists(Path.Combine(_dir, "bad", "truth.json")));
    }

    [Fact]
    public void Simulate_json_carries_the_leap_second_warning_when_the_time_lies_beyond_the_table()
    {
        // GPS 1500000000 is 2027-07-19, after the bundled table's expiry (2027-06-28).
        var (exit, output, err) = CliRunner.Run(SimulateCommand.Build(), "simulate", "--network", _network, "--out", Path.Combine(_dir, "late"), "--seed", "5",
            "--duration-s", "4", "--sample-rate", "1024", "--gps", "1500000000", "--json");
        Assert.True(exit == 0, err);
        var warnings = JsonDocument.Parse(output).RootElement.GetProperty("warnings").EnumerateArray().Select(w => w.GetString()).ToList();
        Assert.Contains(warnings, w => w!.Contains("leap-second table's expiry", StringComparison.Ordinal));
    }

    [Fact]
    public void Simulate_names_a_missing_network_file()
    {
        var (exit, _, err) = CliRunner.Run(SimulateCommand.Build(), "simulate", "--network", Path.Combine(_dir, "nope.json"), "--out", _dir, "--seed", "1");
        Assert.Equal(2, exit);
        Assert.Contains("nope.json", err);
    }
}
