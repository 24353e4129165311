using System.CommandLine;
using System.Globalization;
using System.Text;
using System.Text.Json;
using EventReview.Cli.Commands;

namespace EventReview.Cli.Tests.Commands;

[Collection("Console")]
public sealed class BackgroundCommandTests : IDisposable
{
    private readonly string _dir = Directory.CreateTempSubdirectory("bgcli").FullName;

    public void Dispose() => Directory.Delete(_dir, recursive: true);

    [Fact]
    public void Background_json_has_the_contract_fields()
    {
        var args = Files() + " --window-ms 10 --step-s 7 --slides 200 --candidate-stat 9 --json";
        var (code, stdout, stderr) = Run(args.Split(' '));
        Assert.True(code == 0, stderr);
        using var doc = JsonDocument.Parse(stdout);
        var root = doc.RootElement;
        // the fields of earlier versions stay; the verdict and the bound flags are added (issue contract)
        string[] expected = ["slides", "backgroundSeconds", "backgroundCoincidences", "louder", "farHz", "farIsBound", "fap", "sigma", "elapsedMs",
            "verdict", "reason", "significanceBand", "fapIsBound", "sigmaIsBound", "farBoundConfidence", "slidePValue", "pairs"];
        Assert.All(expected, name => Assert.True(root.TryGetProperty(name, out _), name));
        Assert.Equal(400, root.GetProperty("slides").GetInt32());
        Assert.Equal(400 * 20_000.0, root.GetProperty("backgroundSeconds").GetDouble(), 1e-6); // both sites analyse the whole 20,000 s
        var louder = root.GetProperty("louder").GetInt64();
        Assert.Equal(louder == 0, root.GetProperty("farIsBound").GetBoolean());
        Assert.True(root.GetProperty("backgroundCoincidences").GetInt64() > 0);
        var far = root.GetProperty("farHz").GetDouble();
        Assert.Equal((louder == 0 ? 2.302585092994046 : louder) / 8e6, far, 1e-18); // 90 % bound when nothing is as loud (Gehrels 1986)
        Assert.Equal(louder == 0, root.GetProperty("fapIsBound").GetBoolean());
        Assert.Equal(root.GetProperty("verdict").GetString() == "concern" ? "background too short" : root.GetProperty("verdict").GetString(), root.GetProperty("significanceBand").GetString());
        Assert.NotEqual("consistent", root.GetProperty("verdict").GetString());
        Assert.Equal(1 - Math.Exp(-far * 20_000), root.GetProperty("fap").GetDouble(), 1e-12); // T_obs = zero-lag coincident time
    }

    [Fact]
    public void Three_sites_use_a_window_per_pair_from_the_network_and_give_the_joint_figure()
    {
        var args = Files(sites: 3) + $" --network {Network()} --tolerance-ms 2 --step-s 7 --slides 100 --candidate-time 1300010000 --remove-candidate-triggers --json";
        var (code, stdout, stderr) = Run(args.Split(' '));
        Assert.True(code == 0, stderr);
        using var doc = JsonDocument.Parse(stdout);
        var root = doc.RootElement;
        var pairs = root.GetProperty("pairs").EnumerateArray().ToList();
        Assert.Equal(3, pairs.Count);
        Assert.All(pairs, p => Assert.StartsWith("light-travel", p.GetProperty("plan").GetProperty("windowRule").GetString(), StringComparison.Ordinal));
        Assert.Equal(3, pairs.Select(p => p.GetProperty("plan").GetProperty("windowMs").GetDouble()).Distinct().Count()); // three baselines, three windows
        var triple = root.GetProperty("triple");
        Assert.Equal(3, triple.GetProperty("windowsMs").GetArrayLength());
        Assert.Equal(JsonValueKind.Object, triple.GetProperty("withoutCandidateTriggers").ValueKind);
        var joint = root.GetProperty("joint");
        Assert.Equal(4, joint.GetProperty("types").GetArrayLength());
        Assert.Equal(joint.GetProperty("figures").GetProperty("farHz").GetDouble(), root.GetProperty("farHz").GetDouble());
        Assert.Equal(joint.GetProperty("verdict").GetString(), root.GetProperty("verdict").GetString());
        Assert.StartsWith("2021-03-17T09:53:02", root.GetProperty("candidateUtc").GetString(), StringComparison.Ordinal); // CHECKS.md: GPS 1167264018 = 2017-01-01T00:00:00, no leap second since (Python datetime for the difference)
        Assert.True(root.GetProperty("leapSeconds").TryGetProperty("tableExpires", out _));
    }

    [Fact]
    public void A_malformed_trigger_file_exits_2_with_a_one_line_message_naming_the_line()
    {
        Files();
        File.WriteAllText(Path.Combine(_dir, "a.csv"), "gps_time,snr\n1300000000,5\n1300000001,NaN\n");
        var args = Files(writeTriggers: false) + " --window-ms 10 --step-s 7 --slides 5 --candidate-stat 9 --json";
        var (code, stdout, stderr) = Run(args.Split(' '));
        Assert.Equal(2, code);
        Assert.Equal(string.Empty, stdout);
        Assert.Contains("line 3", stderr);
        Assert.Single(stderr.Trim().Split('\n'));
    }

    [Fact]
    public void A_missing_segment_file_for_a_site_exits_2()
    {
        var args = Files().Replace("--segments MV=", "--segments XQ=", StringComparison.Ordinal) + " --window-ms 10 --step-s 7 --slides 5 --candidate-stat 9";
        var (code, _, stderr) = Run(args.Split(' '));
        Assert.Equal(2, code);
        Assert.Contains("MV", stderr);
    }

    private string Network()
    {
        // three invented sites (letters only) on different baselines
        var path = Path.Combine(_dir, "net.json");
        File.WriteAllText(path, """
            {"name": "Invented", "sites": [
              {"code": "KX", "name": "Site KX", "latitudeDegrees": 12, "longitudeDegrees": 31, "heightMeters": 100, "xArmAzimuthDegrees": 10, "yArmAzimuthDegrees": 100, "timingUncertaintySeconds": 0.0001},
              {"code": "MV", "name": "Site MV", "latitudeDegrees": -20, "longitudeDegrees": 80, "heightMeters": 0, "xArmAzimuthDegrees": 200, "yArmAzimuthDegrees": 290, "timingUncertaintySeconds": 0.0001},
              {"code": "PQ", "name": "Site PQ", "latitudeDegrees": 50, "longitudeDegrees": 95, "heightMeters": 30, "xArmAzimuthDegrees": 70, "yArmAzimuthDegrees": 160, "timingUncertaintySeconds": 0.0001}]}
            """);
        return path;
    }

    private string Files(bool writeTriggers = true, int sites = 2)
    {
        var rng = new Random(4);
        foreach (var code in new[] { "a", "b", "c" }.Take(sites))
        {
            if (writeTriggers || code == "b")
            {
                var sb = new StringBuilder("snr,gps_time\n");
                for (var t = rng.NextDouble() * 5; t < 20_000; t += rng.NextDouble() * 10)
                {
                    sb.Append(CultureInfo.InvariantCulture, $"{5 + (rng.NextDouble() * 3):F3},{1_300_000_000 + t:F6}\n");
                }

                if (sites == 3)
                {
                    sb.Append(CultureInfo.InvariantCulture, $"12.000,{1_300_010_000 + (code == "b" ? 0.004 : code == "c" ? -0.003 : 0):F6}\n"); // the candidate, seen by all three
                }

                File.WriteAllText(Path.Combine(_dir, code + ".csv"), sb.ToString());
            }

            File.WriteAllText(Path.Combine(_dir, code + "-seg.csv"), "start_gps,end_gps\n1300000000,1300010000\n1300010000,1300020000\n");
        }

        var third = sites == 3 ? $" --triggers PQ={_dir}/c.csv --segments PQ={_dir}/c-seg.csv" : string.Empty;
        return $"background --triggers KX={_dir}/a.csv --triggers MV={_dir}/b.csv --segments KX={_dir}/a-seg.csv --segments MV={_dir}/b-seg.csv" + third;
    }

    private static (int Code, string Stdout, string Stderr) Run(string[] args)
    {
        var root = new RootCommand();
        root.Subcommands.Add(BackgroundCommand.Build());
        var oldOut = Console.Out;
        var oldErr = Console.Error;
        var sw = new StringWriter();
        var ew = new StringWriter();
        try
        {
            Console.SetOut(sw);
            Console.SetError(ew);
            var code = root.Parse(args).Invoke(new InvocationConfiguration { Output = sw, Error = ew });
            return (code, sw.ToString(), ew.ToString());
        }
        finally
        {
            Console.SetOut(oldOut);
            Console.SetError(oldErr);
        }
    }
}
