using System.CommandLine;
using EventReview.Cli.Commands;
using EventReview.Cli.Tests.Commands;

namespace EventReview.Cli.Tests;

/// <summary>Every number the command line accepts has a stated range; NaN, infinities and values outside it are refused before a verb runs.</summary>
[Collection("Console")]
public sealed class OptionRangesTests
{
    private static readonly Type[] NumericTypes = [typeof(double), typeof(double?), typeof(int), typeof(int?), typeof(long), typeof(long?), typeof(decimal), typeof(decimal?)];

    /// <summary>Every numeric option of every verb, with its "verb [sub-verb] option" key.</summary>
    public static IEnumerable<(string Key, Command Verb, Option Option)> NumericOptions()
    {
        IEnumerable<(string, Command, Option)> Walk(Command c, string path) =>
            c.Options.Where(o => NumericTypes.Contains(o.ValueType)).Select(o => ($"{path} {o.Name}", c, o))
                .Concat(c.Subcommands.SelectMany(s => Walk(s, $"{path} {s.Name}")));
        return CommandCatalog.All().Select(OptionRanges.Apply).SelectMany(c => Walk(c, c.Name));
    }

    public static TheoryData<string> RangedOptions() => [.. OptionRanges.Table.Keys];

    [Fact]
    public void Every_numeric_option_has_a_stated_range_or_is_an_id()
    {
        var options = NumericOptions().Select(o => o.Key).ToList();

        Assert.NotEmpty(options);
        Assert.DoesNotContain(options, k => !OptionRanges.Table.ContainsKey(k) && !OptionRanges.Unbounded.Contains(k));
        Assert.Empty(OptionRanges.Table.Keys.Except(options)); // no stale row
    }

    [Fact]
    public void Every_default_lies_inside_its_range_and_the_help_states_the_range()
    {
        var defaults = 0;
        foreach (var (key, verb, option) in NumericOptions().Where(o => OptionRanges.Table.ContainsKey(o.Key)))
        {
            var (min, max, _) = OptionRanges.Table[key];
            var root = new RootCommand("test") { verb };
            var value = option.Required ? null : root.Parse([.. key.Split(' ')[..^1]]).GetResult(option)?.GetValueOrDefault<object?>();
            if (value is not null)
            {
                var x = Convert.ToDouble(value, System.Globalization.CultureInfo.InvariantCulture);
                Assert.True(x >= min && x <= max, $"{key}: default {x} outside {min}..{max}");
                defaults++;
            }

            Assert.Contains("ange ", option.Description, StringComparison.Ordinal);
        }

        Assert.True(defaults >= 15, $"only {defaults} defaults were read");
    }

    [Theory]
    [MemberData(nameof(RangedOptions))]
    public void A_ranged_option_refuses_nan_infinities_and_values_beyond_its_range_naming_itself(string key)
    {
        var (_, verb, option) = NumericOptions().Single(o => o.Key == key);
        var (min, max, _) = OptionRanges.Table[key];
        var root = new RootCommand("test") { verb };
        var path = key.Split(' ')[..^1];
        var whole = option.ValueType == typeof(int) || option.ValueType == typeof(int?);
        string[] bad = whole
            ? [((long)min - 1).ToString(System.Globalization.CultureInfo.InvariantCulture), ((long)max + 1).ToString(System.Globalization.CultureInfo.InvariantCulture)]
            : ["NaN", "Infinity", "-Infinity", "1e308", "-1e308", "1e400", (max * 1.0001 + 1).ToString("R", System.Globalization.CultureInfo.InvariantCulture),
               (min - (Math.Abs(min) * 0.0001) - 1).ToString("R", System.Globalization.CultureInfo.InvariantCulture)];

        foreach (var value in bad)
        {
            var errors = root.Parse([.. path, option.Name, value]).Errors.Select(e => e.Message).ToList();

            Assert.Contains(errors, e => e.StartsWith($"{option.Name}: expected a finite number from", StringComparison.Ordinal) || e.Contains($"'{option.Name}'", StringComparison.Ordinal));
        }

        var inside = whole ? ((long)min).ToString(System.Globalization.CultureInfo.InvariantCulture) : ((min + max) / 2).ToString("R", System.Globalization.CultureInfo.InvariantCulture);
        Assert.DoesNotContain(root.Parse([.. path, option.Name, inside]).Errors, e => e.Message.StartsWith(option.Name + ":", StringComparison.Ordinal));
    }

    [Fact]
    public void The_tool_exits_with_2_for_a_number_out_of_range_and_says_which()
    {
        var network = CliRunner.TempFile("""
            {"name": "Invented test network", "sites": [
              {"code": "KX", "name": "Site KX", "latitudeDegrees": 44, "longitudeDegrees": -101, "heightMeters": 100, "xArmAzimuthDegrees": 62, "yArmAzimuthDegrees": 152, "timingUncertaintySeconds": 0.0001},
              {"code": "MV", "name": "Site MV", "latitudeDegrees": 19, "longitudeDegrees": -71, "heightMeters": 0, "xArmAzimuthDegrees": 117, "yArmAzimuthDegrees": 207, "timingUncertaintySeconds": 0.0001}]}
            """, ".json");
        try
        {
            var (exit, _, err) = RunProgram("timing", "--network", network, "--arrival", "KX=1400000000", "--arrival", "MV=1400000000.003", "--k-sigma", "1e308");
            var (ok, output, _) = RunProgram("timing", "--network", network, "--arrival", "KX=1400000000", "--arrival", "MV=1400000000.003", "--k-sigma", "3");

            Assert.Equal(2, exit);
            Assert.Contains("--k-sigma: expected a finite number from 0 to 10 (got 1e308)", err, StringComparison.Ordinal);
            Assert.Equal(0, ok);
            Assert.Contains("k = 3", output, StringComparison.Ordinal);
        }
        finally
        {
            File.Delete(network);
        }
    }

    /// <summary>The tool's own entry point (top-level statements), with standard output and error captured.</summary>
    private static (int Exit, string Out, string Err) RunProgram(params string[] args)
    {
        var (oldOut, oldErr) = (Console.Out, Console.Error);
        using var output = new StringWriter();
        using var error = new StringWriter();
        Console.SetOut(output);
        Console.SetError(error);
        try
        {
            var entry = typeof(Program).Assembly.EntryPoint ?? throw new InvalidOperationException("no entry point");
            var result = entry.Invoke(null, [args]);
            var exit = result is Task<int> task ? task.GetAwaiter().GetResult() : (int)result!;
            return (exit, output.ToString(), error.ToString());
        }
        finally
        {
            Console.SetOut(oldOut);
            Console.SetError(oldErr);
        }
    }
}
