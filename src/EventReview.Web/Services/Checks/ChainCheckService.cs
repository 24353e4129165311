using System.Globalization;
using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Chain;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Io;
using EventReview.Core.Verdicts;
using EventReview.Web.Auth;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Runs the data-chain check on attached series (text "gps_time value" per line) and a stage-model JSON: predicts each
/// stage's output from its input, tests the residual around the case time, and stores the report and one picture per
/// stage as a computation record. Re-running with the same inputs and parameters adds nothing.
/// </summary>
public sealed class ChainCheckService(CaseQueries cases, CaseWorkflow workflow, CaseFiles files)
{
    /// <summary>Runs the check, reporting progress as (fraction, sentence); returns the updated case and whether a record was added.</summary>
    /// <exception cref="ArgumentException">A missing pick, a parameter out of range, or series that do not fit together (names the stage).</exception>
    /// <exception cref="FormatException">A file that does not parse (names the file and the line or stage).</exception>
    public async Task<(ReviewCase Case, bool Added)> RunAsync(ClaimsPrincipal user, int caseId, string itemKey, ChainCheckParameters parameters,
        Action<double, string>? progress = null, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "run checks");
        ArgumentNullException.ThrowIfNull(parameters);
        parameters.Validate();
        progress ??= (_, _) => { };
        var c = await cases.GetAsync(user, caseId, ct);
        var item = c.Item(itemKey);
        var attached = CaseFiles.List(c);
        var steps = parameters.OutputShas.Count + 3.0;
        progress(0, "reading the stage model");
        var (models, modelFile) = await CheckInputs.ReadTextAsync(files, attached, parameters.ModelSha, "stage model", r => ChainModelJson.Parse(r.ReadToEnd()), ct);
        if (models.Count != parameters.OutputShas.Count)
        {
            throw new ArgumentException($"The model '{modelFile.FileName}' has {models.Count} stage(s) but {parameters.OutputShas.Count} output file(s) were picked: give one output per stage, in order.", nameof(parameters.OutputShas));
        }

        progress(1 / steps, "reading the input series");
        var (input, inputFile) = await CheckInputs.ReadTextAsync(files, attached, parameters.InputSha, "input series", r => StrainTextReader.Read(r), ct);
        var refs = new List<CheckFileRef> { modelFile, inputFile };
        var outputs = new List<TimeSeries>();
        for (var k = 0; k < parameters.OutputShas.Count; k++)
        {
            ct.ThrowIfCancellationRequested();
            progress((2 + k) / steps, $"reading the output of stage {k + 1} of {parameters.OutputShas.Count}");
            var (series, f) = await CheckInputs.ReadTextAsync(files, attached, parameters.OutputShas[k], $"stage {k + 1} output series", r => StrainTextReader.Read(r), ct);
            outputs.Add(series);
            refs.Add(f);
        }

        var fingerprint = CheckRecords.Fingerprint(new { center = c.GpsNanoseconds, files = refs.Select(r => new { r.Role, r.Sha256 }) });
        var parametersJson = CheckRecords.Serialize(parameters);
        var latest = CheckRecords.Latest(item.Computations, CheckKind.Chain);
        if (CheckRecords.SameRun(latest, fingerprint, parametersJson))
        {
            return (c, false);
        }

        ct.ThrowIfCancellationRequested();
        progress((steps - 1) / steps, $"predicting and testing {models.Count} stage(s), {input.Length:N0} input samples");
        var (report, traces) = DataChainCheck.RunWithTraces(input, outputs, models, c.Gps, new DataChainOptions(parameters.WindowSeconds, parameters.FalseAlarmProbability));
        var pictures = string.Join(CheckRecords.PictureSeparator, traces.SelectMany((t, i) => new[]
        {
            Core.Plots.PlotSvg.Write(Core.Plots.Figures.ChainResidualFigure.Build(t, report.Stages[i], report.CenterGps, report.WindowSeconds)),
            Core.Plots.PlotSvg.Write(Core.Plots.Figures.ChainSpectrumFigure.Build(t, report.Stages[i])),
        }));
        var result = new ChainRecordResult(RecordFormat.Current, report, refs);
        var summary = Summarise(report);
        ct.ThrowIfCancellationRequested();
        var updated = await workflow.AddComputationAsync(user, caseId, itemKey,
            now => new ComputationRecord(CheckKind.Chain, parametersJson, fingerprint, CheckRecords.ToolVersion, CheckRecords.Serialize(result),
                report.Judgement.Word, summary, pictures, user.ToActor(), now), ct);
        return (updated, true);
    }

    /// <summary>One line: per stage the largest on-source excursion against its threshold, and whether the model fits.</summary>
    public static string Summarise(DataChainReport r) =>
        $"{r.Judgement.Word}: " + string.Join("; ", r.Stages.Select(s => string.Create(CultureInfo.InvariantCulture,
            $"stage {s.Stage} max on-source residual {s.MaxExcessSigma:0.0}σ at {s.MaxExcessGps - r.CenterGps:+0.000;-0.000} s (threshold {s.ThresholdSigma:0.00}σ for false-alarm probability {s.FalseAlarmProbability:G2} over {s.SamplesTested:N0} samples), model {(s.ModelFits ? "fits" : "does not fit")} (coherent fraction {s.CoherentFraction:P0}){(s.OutsideWindowCount > 0 ? $", {s.OutsideWindowCount} excursion(s) outside the window" : string.Empty)}"))) + ".";

}
