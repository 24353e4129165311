using System.CommandLine;
using System.Globalization;
using EventReview.Core.Chain;

namespace EventReview.Cli.Commands;

/// <summary>
/// <c>eventreview chain</c>: data-chain check of one stage or a chain of stages, with the same Core code and verdict as the app
/// (<see cref="DataChainCheck"/>): only the on-source window decides, the threshold comes from a stated false-alarm probability,
/// excursions elsewhere are listed, and a model that does not fit is said so.
/// </summary>
public static class ChainCommand
{
    public static Command Build()
    {
        var input = new Option<string>("--input") { Description = "Recorded input of the first stage (text: gps_time value per line).", Required = true };
        var output = new Option<string[]>("--output") { Description = "Recorded output of each stage, in order (repeat once per stage).", Required = true };
        var zpk = new Option<string>("--zpk") { Description = "Model JSON: {\"stages\": [{\"zerosHz\", \"polesHz\", \"gain\", \"delaySeconds\", \"prewarpHz\", \"expectedNoiseRms\"}]}.", Required = true };
        var center = new Option<string>("--center") { Description = "Candidate GPS time.", Required = true };
        var window = new Option<double>("--window-s") { Description = "On-source half window, seconds (only it is searched for the verdict).", DefaultValueFactory = _ => 1.0 };
        var falseAlarm = new Option<double>("--false-alarm-probability") { Description = "Probability that noise alone crosses the threshold somewhere in a stage's on-source samples.", DefaultValueFactory = _ => 1e-3 };
        var json = new Option<bool>("--json") { Description = "Write the result as JSON (stages[].added, modelFits, outsideWindow[], verdict)." };
        var command = new Command("chain", "Predict each stage's output from its input with its ZPK model and test the residual: residual is noise, excess found, or model does not fit.");
        foreach (var o in new Option[] { input, output, zpk, center, window, falseAlarm, json })
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

            var x = LocalCausesInput.Series(parse.GetValue(input)!, "--input");
            var ys = (parse.GetValue(output) ?? []).Select(p => LocalCausesInput.Series(p, "--output")).ToList();
            var t0 = LocalCausesInput.Gps(parse.GetValue(center)!, "--center");
            var report = DataChainCheck.Run(x, ys, models, t0, new DataChainOptions(parse.GetValue(window), parse.GetValue(falseAlarm)));
            var leap = LocalCausesInput.Leap(t0);
            if (parse.GetValue(json))
            {
                CliOutput.WriteJsonWithVerdicts(new
                {
                    report.Judgement,
                    report.CenterGps,
                    CenterUtc = leap.Utc,
                    report.WindowSeconds,
                    report.FalseAlarmProbability,
                    report.Stages,
                    report.Assumptions,
                    LeapSeconds = leap,
                });
                return CliOutput.Success;
            }

            LocalCausesInput.WarnLeap(leap);
            foreach (var s in report.Stages)
            {
                Console.Out.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"stage {s.Stage}: on-source max {s.MaxExcessSigma:F2} sigma (threshold {s.ThresholdSigma:F2} for P {s.FalseAlarmProbability:G2} over {s.SamplesTested} samples) at {s.MaxExcessGps:F4}; model {(s.ModelFits ? "fits" : "does not fit")} (coherent fraction {s.CoherentFraction:P0}); {s.OutsideWindowCount} excursion(s) outside the window; {s.Judgement.Word}"));
            }

            Console.Out.WriteLine($"verdict: {report.Judgement.Word} ({report.Judgement.Reason})");
            return CliOutput.Success;
        }));
        return command;
    }
}
