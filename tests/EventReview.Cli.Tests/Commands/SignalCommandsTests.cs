using System.CommandLine;
using System.Text.Json;
using EventReview.Cli.Commands;
using EventReview.Core.Signal.Io;
using EventReview.Core.Signal.Simulation;
using EventReview.Core.Time;

namespace EventReview.Cli.Tests.Commands;

[Collection("Console")]
public class SignalCommandsTests : IDisposable
{
    private static readonly GpsTime Start = GpsTime.FromSeconds(1300000000m);
    private readonly string _dir = Directory.CreateTempSubdirectory("er-cli-signal-").FullName;

    public SignalCommandsTests()
    {
        SiteProjection[] sites = [new("KX", 0, 0.8, 0.1), new("MV", 0.0124, -0.6, -0.075)];
        var sim = NetworkSimulator.Simulate(sites, new SimulationOptions(Start, 16, 4096, 5, new ChirpParameters(8, InclinationRad: 0.3), null, 40));
        StrainTextWriter.WriteFile(Path.Combine(_dir, "a.txt"), sim.Sites[0].Strain);
        StrainTextWriter.WriteFile(Path.Combine(_dir, "b.txt"), sim.Sites[1].Strain);
        File.WriteAllText(Path.Combine(_dir, "bad.txt"), "1 0\n2 0\n3 oops\n");
    }

    public void Dispose()
    {
        Directory.Delete(_dir, true);
        GC.SuppressFinalize(this);
    }

    private static (int Code, string Out, string Err) Run(Command command, params string[] args)
    {
        var root = new RootCommand { command };
        var oldOut = Console.Out;
        var oldErr = Console.Error;
        var o = new StringWriter();
        var e = new StringWriter();
        Console.SetOut(o);
        Console.SetError(e);
        try
        {
            int code = root.Parse(args).Invoke();
            return (code, o.ToString(), e.ToString());
        }
        finally
        {
            Console.SetOut(oldOut);
            Console.SetError(oldErr);
        }
    }

    [Fact]
    public void Overlap_verb_reports_the_contract_fields_as_json()
    {
        var (code, output, err) = Run(OverlapCommand.Build(), "overlap", "--a", Path.Combine(_dir, "a.txt"), "--b", Path.Combine(_dir, "b.txt"),
            "--center", "1300000008", "--offsource", "200", "--max-lag-ms", "18", "--json");
        Assert.True(code == 0, err);
        var doc = JsonDocument.Parse(output).RootElement;
        // contract of issue 13: verdict, lagSeconds, lagUncertaintySeconds, phaseRadians, atSearchEdge
        Assert.Equal("consistent", doc.GetProperty("verdict").GetString());
        // simulator truth: arrival(A) - arrival(B) = -12.4 ms, flipped (phase 180°)
        double sigma = doc.GetProperty("lagUncertaintySeconds").GetDouble();
        Assert.True(sigma > 0 && Math.Abs(doc.GetProperty("lagSeconds").GetDouble() + 0.0124) <= 3 * sigma, output);
        Assert.True(Math.Abs(Math.Abs(doc.GetProperty("phaseRadians").GetDouble()) - Math.PI) <= 3 * doc.GetProperty("phaseUncertaintyRadians").GetDouble(), output);
        Assert.False(doc.GetProperty("atSearchEdge").GetBoolean());
        Assert.Equal(-1, doc.GetProperty("sign").GetInt32());
        Assert.True(doc.GetProperty("overlap").GetDouble() > 0.3);
        Assert.Equal(1.0 / 201, doc.GetProperty("pValue").GetDouble(), 1e-12);
        Assert.Equal(4096, doc.GetProperty("sampleRateHz").GetDouble());
        Assert.True(doc.GetProperty("elapsedMs").GetDouble() > 0);
    }

    [Fact]
    public void Overlap_verb_takes_its_lag_limit_from_the_network_and_has_no_fixed_default()
    {
        // Invented two-site network whose light-travel time (~16 ms) plus 3σ covers the simulated 12.4 ms delay.
        var net = Path.Combine(_dir, "net.json");
        File.WriteAllText(net, """
            {"name": "Two invented sites", "sites": [
              {"code": "PQ", "name": "Pine Quarry", "latitudeDegrees": 10, "longitudeDegrees": 0, "heightMeters": 0, "xArmAzimuthDegrees": 0, "yArmAzimuthDegrees": 90, "timingUncertaintySeconds": 0.0002},
              {"code": "RS", "name": "Reed Shore", "latitudeDegrees": 10, "longitudeDegrees": 45, "heightMeters": 0, "xArmAzimuthDegrees": 45, "yArmAzimuthDegrees": 135, "timingUncertaintySeconds": 0.0002}]}
            """);
        var (code, output, err) = Run(OverlapCommand.Build(), "overlap", "--a", Path.Combine(_dir, "a.txt"), "--b", Path.Combine(_dir, "b.txt"),
            "--center", "1300000008", "--network", net, "--site-a", "PQ", "--site-b", "RS", "--json");
        Assert.True(code is 0 or 1, err);
        var doc = JsonDocument.Parse(output).RootElement;
        var travel = Core.Geodesy.Baseline.Between(Core.Network.NetworkFile.Read(net).Sites[0], Core.Network.NetworkFile.Read(net).Sites[1]).LightTravelSeconds;
        double allowed = travel + (3 * Math.Sqrt(2) * 2e-4);
        Assert.Equal(Math.Floor(allowed * 4096) / 4096, doc.GetProperty("maxLagSeconds").GetDouble(), 1e-9); // whole samples inside the pair window
        Assert.Contains("light-travel PQ–RS", doc.GetProperty("allowedLagRule").GetString());

        var (none, _, message) = Run(OverlapCommand.Build(), "overlap", "--a", Path.Combine(_dir, "a.txt"), "--b", Path.Combine(_dir, "b.txt"), "--center", "1300000008");
        Assert.Equal(2, none);
        Assert.Contains("--network", message);
    }

    [Fact]
    public void Chirp_verb_reports_the_chirp_mass_as_json()
    {
        var (code, output, err) = Run(ChirpCommand.Build(), "chirp", "--a", Path.Combine(_dir, "a.txt"), "--center", "1300000008", "--json");
        Assert.True(code == 0, err);
        var doc = JsonDocument.Parse(output).RootElement;
        Assert.True(doc.GetProperty("chirpLike").GetBoolean());
        Assert.Equal(8, doc.GetProperty("chirpMassMsun").GetDouble(), 0.8);
        Assert.True(doc.GetProperty("chirpMassSigmaMsun").GetDouble() > 0);
        Assert.Contains(doc.GetProperty("scope").EnumerateArray(), s => s.GetString()!.StartsWith("cannot tell", StringComparison.Ordinal));
        Assert.True(doc.GetProperty("qPlanes").GetArrayLength() >= 3);
    }

    [Fact]
    public void A_malformed_file_exits_with_two_and_names_the_line()
    {
        var (code, output, err) = Run(OverlapCommand.Build(), "overlap", "--a", Path.Combine(_dir, "bad.txt"), "--b", Path.Combine(_dir, "b.txt"),
            "--center", "1300000008", "--max-lag-ms", "18", "--json");
        Assert.Equal(2, code);
        Assert.Equal(string.Empty, output);
        Assert.Contains("line 3", err);
        Assert.Single(err.Trim().Split('\n'));
    }

    [Fact]
    public void A_bad_centre_or_band_exits_with_two()
    {
        Assert.Equal(2, Run(ChirpCommand.Build(), "chirp", "--a", Path.Combine(_dir, "a.txt"), "--center", "yesterday").Code);
        Assert.Equal(2, Run(OverlapCommand.Build(), "overlap", "--a", Path.Combine(_dir, "a.txt"), "--b", Path.Combine(_dir, "b.txt"), "--center", "1300000008", "--band", "300,30", "--max-lag-ms", "18").Code);
    }
}
