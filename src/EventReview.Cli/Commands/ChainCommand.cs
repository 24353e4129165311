using System.CommandLine;
using System.Globalization;
using EventReview.Core.Chain;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Io;

namespace EventReview.Cli.Commands;

/// <summary><c>eventreview chain</c>: data-chain check of one stage or a chain of stages.</summary>
public static class ChainCommand
{
    public static Command Build()
    {
        var input = new Option<string>("--input") { Description = "Recorded input of the first stage (text: gps_time value per line).", Required = true };
        var output = new Option<string[]>("--output") { Description = "Recorded output of each stage, in order (repeat once per stage).", Required = true };
        var zpk = new Option<string>("--zpk") { Description = "Model JSON: {\"stages\": [{\"zerosHz\", \"polesHz\", \"gain\", \"delaySeconds\", \"prewarpHz\"}]}.", Required = true };
        var center = new Option<string>("--center") { Description = "Candidate GPS time.", Required = true };
        var window = new Option<double>("--window-s") { Description = "On-source half window, seconds.", DefaultValueFactory = _ => 1.0 };
        var sigma = new Option<double>("--sigma") { Description = "Threshold in robust sigma.", DefaultValueFactory = _ => 5.0 };
        var json = new Option<bool>("--json") { Description = "Write the result as JSON." };
        var command = new Command("chain", "Predict each stage's output from its input with its ZPK model and test the residual for anything added.");
        foreach (var o in new Option[] { input, output, zpk, center, window, sigma, json })
        {
            command.Options.Add(o);
        }

        command.SetAction(parse => LocalCausesInput.Guard(() =>
        {
            var modelPath = parse.GetValue(zpk)!;
            var modelText = File.Exists(modelPath) ? File.ReadAllText(modelPath) : throw new FileNotFoundException($"--zpk: file '{modelPath}' not found");
            IReadOnlyList<ChainStageModel> models;
            try
            {
                models = ChainModelJson.Parse(modelText);
            }
            catch (FormatException ex)
            {
                throw new FormatException($"--zpk {modelPath}: {ex.Message}");
            }

            var x = ReadSeries(parse.GetValue(input)!, "--input");
            var ys = (parse.GetValue(output) ?? []).Select(p => ReadSeries(p, "--output")).ToList();
            var t0 = LocalCausesInput.Gps(parse.GetValue(center)!, "--center");
            var report = DataChainCheck.Run(x, ys, models, t0, new DataChainOptions(parse.GetValue(window), parse.GetValue(sigma)));
            if (parse.GetValue(json))
            {
                CliOutput.WriteJson(report);
                return CliOutput.Success;
            }

            foreach (var s in report.Stages)
            {
                Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"stage {s.Stage}: residual RMS {s.ResidualRms:G4} on-source vs {s.OffSourceRms:G4} off-source; max {s.MaxExcessSigma:F1} sigma at {s.MaxExcessGps:F4}; skipped {s.SkippedStartSeconds:G3} s at each end; {s.Verdict}"));
            }

            Console.Out.WriteLine("verdict: " + report.Verdict);
            return CliOutput.Success;
        }));
        return command;
    }

    private static TimeSeries ReadSeries(string path, string option)
    {
        if (!File.Exists(path))
        {
            throw new FileNotFoundException($"{option}: file '{path}' not found");
        }

        try
        {
            return StrainTextReader.ReadFile(path);
        }
        catch (StrainFormatException ex)
        {
            throw new FormatException($"{option} {path}: {ex.Message}");
        }
    }
}
