using System.Globalization;
using System.Text;
using System.Text.Json;
using EventReview.Cli.Commands;

namespace EventReview.Cli.Tests;

[Collection("Console")]
public class LocalCausesCommandTests
{
    private static readonly string Segments = CliRunner.TempFile("site,flag,start_gps,end_gps\nKX,gusty-wind,1000000000,1000000000.5\n");
    private static readonly string Triggers = CliRunner.TempFile("site,channel,gps_time,snr\nKX,env/seismometer-hall/x,1000000000.3,12\nKX,env/seismometer-hall/x,1000000900,5\nMV,env/magnetometer-vault/z,1000000050,9\n");
    private static readonly string Injections = CliRunner.TempFile("site,start_gps,end_gps,kind,waveform_ref,status\nKX,1000000500,1000000500.1,burst,w1,performed\n");

    [Fact]
    public void Environment_json_has_hits_segments_and_verdict()
    {
        var (exit, output, _) = CliRunner.Run(EnvironmentCommand.Build(), "environment", "--case-gps", "1000000000", "--arrival", "KX=1000000000.1",
            "--segments", Segments, "--triggers", Triggers, "--injections", Injections, "--json");
        Assert.Equal(0, exit);
        using var doc = JsonDocument.Parse(output);
        var hit = Assert.Single(doc.RootElement.GetProperty("hits").EnumerateArray());
        Assert.Equal("KX", hit.GetProperty("site").GetString());
        Assert.Equal("env/seismometer-hall/x", hit.GetProperty("channel").GetString());
        Assert.Equal("other", hit.GetProperty("kind").GetString());
        Assert.Equal(0.2, hit.GetProperty("offsetSeconds").GetDouble(), 1e-9);
        Assert.Equal(12, hit.GetProperty("snr").GetDouble());
        Assert.True(hit.GetProperty("chanceProbability").GetDouble() > 0);
        Assert.Equal(JsonValueKind.True, hit.GetProperty("safe").ValueKind);
        var seg = Assert.Single(doc.RootElement.GetProperty("segments").EnumerateArray());
        Assert.Equal("gusty-wind", seg.GetProperty("flag").GetString());
        Assert.Equal(1000000000.5, seg.GetProperty("endGps").GetDouble());
        Assert.Equal("concern", doc.RootElement.GetProperty("verdict").GetString());
        Assert.Contains("KX", doc.RootElement.GetProperty("reason").GetString());
        Assert.Equal("concern", doc.RootElement.GetProperty("sites").EnumerateArray().Single(x => x.GetProperty("site").GetString() == "KX").GetProperty("verdict").GetString());
        // UTC of the case time from the leap-second table, with the table's state beside it (CHECKS.md: GPS 1e9 = 2011-09-14T01:46:25 UTC)
        Assert.StartsWith("2011-09-14T01:46:25", doc.RootElement.GetProperty("caseUtc").GetString(), StringComparison.Ordinal);
        var leap = doc.RootElement.GetProperty("leapSeconds");
        Assert.Matches(@"^\d{4}-\d{2}-\d{2}$", leap.GetProperty("tableExpires").GetString()!);
        Assert.Equal(JsonValueKind.False, leap.GetProperty("beyondTableExpiry").ValueKind);
        Assert.True(leap.TryGetProperty("warning", out _));
        Assert.Equal(0.01, doc.RootElement.GetProperty("lightTravelSeconds").GetDouble());
        Assert.StartsWith("default", doc.RootElement.GetProperty("lightTravelSource").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public void Environment_takes_the_cross_site_window_from_the_network_unless_one_is_given()
    {
        var network = CliRunner.TempFile(Network, ".json");
        var args = new[] { "environment", "--case-gps", "1000000000", "--segments", Segments, "--triggers", Triggers, "--network", network, "--json" };
        var (exit, output, err) = CliRunner.Run(EnvironmentCommand.Build(), args);
        Assert.True(exit == 0, err);
        using var doc = JsonDocument.Parse(output);
        var (a, b) = (Site("KX"), Site("MV"));
        Assert.Equal(EventReview.Core.Geodesy.Baseline.Between(a, b).LightTravelSeconds, doc.RootElement.GetProperty("lightTravelSeconds").GetDouble(), 1e-6);
        Assert.StartsWith("network", doc.RootElement.GetProperty("lightTravelSource").GetString(), StringComparison.Ordinal);

        var (_, given, _) = CliRunner.Run(EnvironmentCommand.Build(), [.. args, "--light-travel-s", "0.03"]);
        using var givenDoc = JsonDocument.Parse(given);
        Assert.Equal(0.03, givenDoc.RootElement.GetProperty("lightTravelSeconds").GetDouble());
        Assert.Equal("given", givenDoc.RootElement.GetProperty("lightTravelSource").GetString());
    }

    // Two invented sites (letters only), for the cross-site window.
    private const string Network = """
        {"name": "Invented", "sites": [
          {"code": "KX", "name": "Site KX", "latitudeDegrees": 12, "longitudeDegrees": 31, "heightMeters": 100, "xArmAzimuthDegrees": 10, "yArmAzimuthDegrees": 100, "timingUncertaintySeconds": 0.0001},
          {"code": "MV", "name": "Site MV", "latitudeDegrees": -20, "longitudeDegrees": 80, "heightMeters": 0, "xArmAzimuthDegrees": 200, "yArmAzimuthDegrees": 290, "timingUncertaintySeconds": 0.0001}]}
        """;

    private static EventReview.Core.Network.Site Site(string code) =>
        EventReview.Core.Network.NetworkFile.Parse(Network).Sites.Single(s => s.Code == code);

    [Fact]
    public void Environment_rejects_a_bad_segment_with_exit_2_and_one_line_naming_it()
    {
        var bad = CliRunner.TempFile("site,flag,start_gps,end_gps\nKX,gusty-wind,1000000001,1000000000\n");
        var (exit, _, err) = CliRunner.Run(EnvironmentCommand.Build(), "environment", "--case-gps", "1000000000", "--segments", bad, "--triggers", Triggers, "--json");
        Assert.Equal(2, exit);
        Assert.Single(err.Trim().Split('\n'));
        Assert.Contains("line 2", err);
        Assert.Contains("end_gps", err);
    }

    [Fact]
    public void Safety_json_lists_channels_with_counts_and_flags()
    {
        var (exit, output, _) = CliRunner.Run(SafetyCommand.Build(), "safety", "--triggers", Triggers, "--injections", Injections, "--window-s", "1", "--json");
        Assert.Equal(0, exit);
        using var doc = JsonDocument.Parse(output);
        var channels = doc.RootElement.GetProperty("channels").EnumerateArray().ToList();
        Assert.Equal(2, channels.Count);
        var k1 = channels.Single(c => c.GetProperty("site").GetString() == "KX");
        Assert.Equal("env/seismometer-hall/x", k1.GetProperty("channel").GetString());
        Assert.Equal(0, k1.GetProperty("coincident").GetInt32());
        Assert.True(k1.GetProperty("expected").GetDouble() > 0);
        Assert.Equal(1.0, k1.GetProperty("binomialProbability").GetDouble());
        Assert.True(k1.GetProperty("chanceProbabilityPerInjection").GetDouble() > 0);
        Assert.True(k1.GetProperty("safe").GetBoolean());
        Assert.Equal("safe", k1.GetProperty("verdict").GetString());
        Assert.True(k1.GetProperty("deadtimeSeconds").GetDouble() > 0);
        Assert.Equal(JsonValueKind.Null, channels.Single(c => c.GetProperty("site").GetString() == "MV").GetProperty("safe").ValueKind);
        Assert.Equal("safe", doc.RootElement.GetProperty("verdict").GetString());
    }

    [Fact]
    public void Safety_calls_a_channel_firing_at_every_injection_unsafe()
    {
        // 30 injections of 0.2 s, 100 s apart; a 0.25 Hz comb away from them and one trigger in each injection (CHECKS.md q = 0.42305)
        var trig = new StringBuilder("site,channel,gps_time,snr\n");
        var inj = new StringBuilder("site,start_gps,end_gps,kind,waveform_ref,status\n");
        for (var j = 0; j < 750; j++)
        {
            trig.Append(CultureInfo.InvariantCulture, $"KX,inst/actuator-readback,{1000000000 + (4 * j) + 0.5},6\n");
        }

        for (var m = 0; m < 30; m++)
        {
            inj.Append(CultureInfo.InvariantCulture, $"KX,{1000000000 + (100 * m) + 2},{1000000000 + (100 * m) + 2.2},burst,w,performed\n");
            trig.Append(CultureInfo.InvariantCulture, $"KX,inst/actuator-readback,{1000000000 + (100 * m) + 2.1},20\n");
        }

        var (exit, output, err) = CliRunner.Run(SafetyCommand.Build(), "safety", "--triggers", CliRunner.TempFile(trig.ToString()), "--injections", CliRunner.TempFile(inj.ToString()),
            "--window-s", "1", "--live-time-s", "3066", "--json");
        Assert.True(exit == 0, err);
        using var doc = JsonDocument.Parse(output);
        var c = Assert.Single(doc.RootElement.GetProperty("channels").EnumerateArray());
        Assert.False(c.GetProperty("safe").GetBoolean());
        Assert.Equal(0.42305, c.GetProperty("chanceProbabilityPerInjection").GetDouble(), 5e-6);
        Assert.True(c.GetProperty("binomialProbability").GetDouble() < 1e-10);
        Assert.Equal("unsafe", doc.RootElement.GetProperty("verdict").GetString());
    }

    [Fact]
    public void Seal_then_unseal_is_valid_and_an_altered_record_is_not()
    {
        var record = CliRunner.TempFile("site,start_gps,end_gps,kind,waveform_ref,status\nKX,1000000000,1000000001,cbc,blind.txt,performed\n");
        var (exit, output, _) = CliRunner.Run(SealCommand.Build(), "seal", "--record", record, "--json");
        Assert.Equal(0, exit);
        using var doc = JsonDocument.Parse(output);
        var commitment = doc.RootElement.GetProperty("commitment").GetString()!;
        var salt = doc.RootElement.GetProperty("salt").GetString()!;
        Assert.Matches("^[0-9a-f]{64}$", commitment);
        Assert.Matches("^[0-9a-f]{64}$", salt);
        Assert.Equal("sealed", doc.RootElement.GetProperty("verdict").GetString());
        Assert.Contains("cannot be closed as astrophysical", doc.RootElement.GetProperty("reason").GetString());

        var ok = CliRunner.Run(UnsealCommand.Build(), "unseal", "--commitment", commitment, "--record", record, "--salt", salt);
        Assert.Equal(0, ok.Exit);
        Assert.Equal("valid", ok.Out.Trim().Split('\n')[0]);

        // with the case: the app's closing rule. A blind injection at the candidate holds back "astrophysical"; one far away does not.
        var at = CliRunner.Run(UnsealCommand.Build(), "unseal", "--commitment", commitment, "--record", record, "--salt", salt, "--case-gps", "1000000000.5", "--arrival", "KX=1000000000.5", "--json");
        using (var atDoc = JsonDocument.Parse(at.Out))
        {
            Assert.Equal("concern", atDoc.RootElement.GetProperty("verdict").GetString());
            Assert.Equal("concern", atDoc.RootElement.GetProperty("overlaps").GetProperty("verdict").GetString());
            Assert.True(atDoc.RootElement.TryGetProperty("leapSeconds", out _));
        }

        var away = CliRunner.Run(UnsealCommand.Build(), "unseal", "--commitment", commitment, "--record", record, "--salt", salt, "--case-gps", "1000090000", "--json");
        using (var awayDoc = JsonDocument.Parse(away.Out))
        {
            Assert.Equal("clear", awayDoc.RootElement.GetProperty("verdict").GetString());
        }

        File.AppendAllText(record, " ");
        var bad = CliRunner.Run(UnsealCommand.Build(), "unseal", "--commitment", commitment, "--record", record, "--salt", salt, "--json");
        Assert.Equal(1, bad.Exit);
        using var badDoc = JsonDocument.Parse(bad.Out);
        Assert.False(badDoc.RootElement.GetProperty("valid").GetBoolean());
        Assert.Equal("invalid", badDoc.RootElement.GetProperty("verdict").GetString());

        var badSalt = CliRunner.Run(UnsealCommand.Build(), "unseal", "--commitment", commitment, "--record", record, "--salt", "not-hex");
        Assert.Equal(2, badSalt.Exit);
    }

    [Fact]
    public void Unseal_matches_the_documented_commitment_of_salt_then_file()
    {
        // FIPS 180-2 example (from memory): SHA-256("abc"); salt 0x61 ("a"), file "bc".
        var record = CliRunner.TempFile("bc", ".txt");
        var (exit, output, _) = CliRunner.Run(UnsealCommand.Build(), "unseal", "--commitment",
            "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", "--record", record, "--salt", "61", "--json");
        Assert.Equal(0, exit);
        Assert.Contains("\"valid\": true", output);
    }

    [Fact]
    public void Chain_json_lists_each_stage_with_residuals_and_verdict()
    {
        const double fs = 256;
        var x = new StringBuilder("# gps value\n");
        var y = new StringBuilder();
        var random = new Random(1);
        double state = 0;
        var a = Math.Exp(-2 * Math.PI * 20 / fs);
        for (var i = 0; i < 16 * 256; i++)
        {
            var t = i / fs;
            var input = Math.Sin(2 * Math.PI * 3 * t) + (0.5 * Math.Sin(2 * Math.PI * 11 * t));
            state = (a * state) + ((1 - a) * input); // an unrelated one-pole smoother: the model will not match it exactly
            var gps = (1000000000m + (i / (decimal)fs)).ToString(CultureInfo.InvariantCulture);
            x.Append(CultureInfo.InvariantCulture, $"{gps} {input:R}\n");
            y.Append(CultureInfo.InvariantCulture, $"{gps} {state + (1e-3 * (random.NextDouble() - 0.5)):R}\n");
        }

        var inPath = CliRunner.TempFile(x.ToString(), ".txt");
        var outPath = CliRunner.TempFile(y.ToString(), ".txt");
        var model = CliRunner.TempFile("""{"stages": [{"zerosHz": [], "polesHz": [[-20, 0]], "gain": 125.66370614359172, "delaySeconds": 0, "prewarpHz": null}]}""", ".json");
        var (exit, output, err) = CliRunner.Run(ChainCommand.Build(), "chain", "--input", inPath, "--output", outPath, "--zpk", model, "--center", "1000000008", "--json");
        Assert.True(exit == 0, err);
        using var doc = JsonDocument.Parse(output);
        var stage = Assert.Single(doc.RootElement.GetProperty("stages").EnumerateArray());
        foreach (var name in new[] { "residualRms", "offSourceRms", "maxExcessSigma", "maxExcessGps" })
        {
            Assert.Equal(JsonValueKind.Number, stage.GetProperty(name).ValueKind);
        }

        Assert.Contains(stage.GetProperty("added").ValueKind, new[] { JsonValueKind.True, JsonValueKind.False });
        Assert.Contains(stage.GetProperty("modelFits").ValueKind, new[] { JsonValueKind.True, JsonValueKind.False });
        Assert.Equal(JsonValueKind.Array, stage.GetProperty("outsideWindow").ValueKind);
        Assert.Contains(stage.GetProperty("verdict").GetString(), new[] { "residual is noise", "excess found", "model does not fit" });
        Assert.Equal(stage.GetProperty("verdict").GetString(), doc.RootElement.GetProperty("verdict").GetString()); // one stage
        Assert.True(doc.RootElement.GetProperty("leapSeconds").TryGetProperty("tableExpires", out _));
        Assert.Equal(1e-3, doc.RootElement.GetProperty("falseAlarmProbability").GetDouble());

        var unstable = CliRunner.TempFile("""{"stages": [{"polesHz": [[5, 0]], "gain": 1}]}""", ".json");
        var bad = CliRunner.Run(ChainCommand.Build(), "chain", "--input", inPath, "--output", outPath, "--zpk", unstable, "--center", "1000000008");
        Assert.Equal(2, bad.Exit);
        Assert.Contains("unstable", bad.Err);
    }
}
