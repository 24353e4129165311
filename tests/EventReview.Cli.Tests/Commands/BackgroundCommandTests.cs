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
        string[] expected = ["slides", "backgroundSeconds", "backgroundCoincidences", "louder", "farHz", "farIsBound", "fap", "sigma", "elapsedMs"];
        Assert.Equal(expected, root.EnumerateObject().Select(p => p.Name));
        Assert.Equal(400, root.GetProperty("slides").GetInt32());
        Assert.Equal(400 * 20_000.0, root.GetProperty("backgroundSeconds").GetDouble(), 1e-6); // both sites analyse the whole 20,000 s
        var louder = root.GetProperty("louder").GetInt64();
        Assert.Equal(louder == 0, root.GetProperty("farIsBound").GetBoolean());
        Assert.True(root.GetProperty("backgroundCoincidences").GetInt64() > 0);
        var far = root.GetProperty("farHz").GetDouble();
        Assert.Equal(Math.Max(1, louder) / 8e6, far, 1e-18);
        Assert.Equal(1 - Math.Exp(-far * 20_000), root.GetProperty("fap").GetDouble(), 1e-12); // T_obs = zero-lag coincident time
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
        var args = Files().Replace("--segments M2=", "--segments X9=", StringComparison.Ordinal) + " --window-ms 10 --step-s 7 --slides 5 --candidate-stat 9";
        var (code, _, stderr) = Run(args.Split(' '));
        Assert.Equal(2, code);
        Assert.Contains("M2", stderr);
    }

    private string Files(bool writeTriggers = true)
    {
        var rng = new Random(4);
        foreach (var code in new[] { "a", "b" })
        {
            if (writeTriggers || code == "b")
            {
                var sb = new StringBuilder("snr,gps_time\n");
                for (var t = rng.NextDouble() * 5; t < 20_000; t += rng.NextDouble() * 10)
                {
                    sb.Append(CultureInfo.InvariantCulture, $"{5 + (rng.NextDouble() * 3):F3},{1_300_000_000 + t:F6}\n");
                }

                File.WriteAllText(Path.Combine(_dir, code + ".csv"), sb.ToString());
            }

            File.WriteAllText(Path.Combine(_dir, code + "-seg.csv"), "start_gps,end_gps\n1300000000,1300010000\n1300010000,1300020000\n");
        }

        return $"background --triggers KX={_dir}/a.csv --triggers M2={_dir}/b.csv --segments KX={_dir}/a-seg.csv --segments M2={_dir}/b-seg.csv";
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
