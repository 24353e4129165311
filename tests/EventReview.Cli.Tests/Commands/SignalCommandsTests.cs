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
        SiteProjection[] sites = [new("KX", 0, 0.8, 0.1), new("M2", 0.0071, -0.6, -0.075)];
        var sim = NetworkSimulator.Simulate(sites, new SimulationOptions(Start, 16, 4096, 5, new ChirpParameters(8, InclinationRad: 0.3), null, 40));
        StrainTextWriter.WriteFile(Path.Combine(_dir, "a.txt"), sim.Sites[0].Strain);
        StrainTextWriter.WriteFile(Path.Combine(_dir, "b.txt"), sim.Sites[1].Strain);
        File.WriteAllText(Path.Combine(_dir, "bad.txt"), "1 0\n2 0\n3 oops\n");
    }

    public void Dispose() => Directory.Delete(_dir, true);

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
    public void Overlap_verb_reports_lag_sign_and_p_value_as_json()
    {
        var (code, output, err) = Run(OverlapCommand.Build(), "overlap", "--a", Path.Combine(_dir, "a.txt"), "--b", Path.Combine(_dir, "b.txt"),
            "--center", "1300000008", "--offsource", "200", "--json");
        Assert.True(code == 0, err);
        var doc = JsonDocument.Parse(output).RootElement;
        // simulator truth: arrival(A) - arrival(B) = -7.1 ms, flipped
        Assert.Equal(-0.0071, doc.GetProperty("lagSeconds").GetDouble(), 1.0 / 4096);
        Assert.Equal(-1, doc.GetProperty("sign").GetInt32());
        Assert.True(doc.GetProperty("overlap").GetDouble() > 0.3);
        Assert.Equal(1.0 / 201, doc.GetProperty("pValue").GetDouble(), 1e-12);
        Assert.Equal(4096, doc.GetProperty("sampleRateHz").GetDouble());
        Assert.True(doc.GetProperty("elapsedMs").GetDouble() > 0);
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
    }

    [Fact]
    public void A_malformed_file_exits_with_two_and_names_the_line()
    {
        var (code, output, err) = Run(OverlapCommand.Build(), "overlap", "--a", Path.Combine(_dir, "bad.txt"), "--b", Path.Combine(_dir, "b.txt"),
            "--center", "1300000008", "--json");
        Assert.Equal(2, code);
        Assert.Equal(string.Empty, output);
        Assert.Contains("line 3", err);
        Assert.Single(err.Trim().Split('\n'));
    }

    [Fact]
    public void A_bad_centre_or_band_exits_with_two()
    {
        Assert.Equal(2, Run(ChirpCommand.Build(), "chirp", "--a", Path.Combine(_dir, "a.txt"), "--center", "yesterday").Code);
        Assert.Equal(2, Run(OverlapCommand.Build(), "overlap", "--a", Path.Combine(_dir, "a.txt"), "--b", Path.Combine(_dir, "b.txt"), "--center", "1300000008", "--band", "300,30").Code);
    }
}
