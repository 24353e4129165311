using System.Text.Json;
using EventReview.Web.Demo;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;

namespace EventReview.Web.Tests.Checks;

public sealed class ChainCheckServiceTests(LocalCausesHarness app) : IClassFixture<LocalCausesHarness>
{
    private async Task<(int CaseId, ChainCheckParameters Parameters, double CenterGps)> CaseWithStageAsync(string id, Action<double[], double>? tamper)
    {
        var c = await app.OpenCaseAsync(id, 1_400_000_400.25m, "candidate-review", ("KP", 0.0), ("AB", 0.006));
        var (input, output) = LocalCausesDemoFiles.ChainStage(c.Gps, 11, tamper);
        var model = await app.AttachAsync(c.Id, "chain.residual", "model.json", LocalCausesDemoFiles.StageModelJson());
        var x = await app.AttachAsync(c.Id, "chain.residual", "input.txt", input);
        var y = await app.AttachAsync(c.Id, "chain.residual", "output.txt", output);
        return (c.Id, new ChainCheckParameters(x, [y], model), c.Gps.Seconds);
    }

    [Fact]
    public async Task Chain_check_on_a_clean_simulated_stage_says_the_residual_is_noise_and_a_rerun_adds_nothing()
    {
        var (caseId, p, _) = await CaseWithStageAsync("T-CHAIN-1", null);
        var progress = new List<string>();
        var service = app.Get<ChainCheckService>();

        var (c, added) = await service.RunAsync(app.Reviewer, caseId, "chain.residual", p, (_, text) => progress.Add(text));

        Assert.True(added);
        var record = Assert.Single(c.Item("chain.residual").Computations);
        Assert.Equal("residual is noise", record.Verdict);
        var result = JsonSerializer.Deserialize<ChainRecordResult>(record.ResultJson, CheckRecords.Json)!;
        Assert.Equal(EventReview.Core.Verdicts.RecordFormat.Current, result.Format);
        var stage = Assert.Single(result.Report.Stages);
        Assert.True(stage.ModelFits);
        // the stated expected noise is the quantisation noise q / sqrt 12 (Widrow); the off-source residual matches it
        Assert.Equal(1.0, stage.NoiseRatio!.Value, 0.05);
        // the output is the model applied to the input, rounded to steps q = 1e-4: the residual is rounding error, uniform in ±q/2,
        // whose largest excursion is (q/2) / (1.4826 x q/4) = 1.35 robust sigma at most (uniform MAD = q/4, from memory)
        Assert.InRange(stage.MaxExcessSigma, 0.5, 1.4);
        Assert.Equal(100, stage.PrewarpHz!.Value, 6); // geometric mean of the two pole magnitudes, both 100 Hz
        Assert.Contains(progress, t => t.Contains("stage", StringComparison.Ordinal));
        Assert.Contains("<svg", record.PicturesSvg, StringComparison.Ordinal);
        Assert.False((await service.RunAsync(app.Reviewer, caseId, "chain.residual", p)).Added);
    }

    [Fact]
    public async Task Chain_check_catches_a_small_burst_added_to_the_output_at_its_time()
    {
        const double burstAt = 0.3;
        var (caseId, p, center) = await CaseWithStageAsync("T-CHAIN-2", (y, fs) =>
        {
            var i0 = (int)Math.Round((16.25 + burstAt) * fs); // the record starts 16 s before the whole second of the case time, i.e. 16.25 s before it
            for (var i = -20; i <= 20; i++)
            {
                y[i0 + i] += 0.01 * Math.Exp(-(i * i) / 50.0) * Math.Sin(2 * Math.PI * 60 * i / fs);
            }
        });

        var (c, _) = await app.Get<ChainCheckService>().RunAsync(app.Reviewer, caseId, "chain.residual", p);

        var record = Assert.Single(c.Item("chain.residual").Computations);
        Assert.Equal("excess found", record.Verdict);
        var stage = JsonSerializer.Deserialize<ChainRecordResult>(record.ResultJson, CheckRecords.Json)!.Report.Stages[0];
        Assert.InRange(stage.MaxExcessGps - center, burstAt - 0.03, burstAt + 0.03);
    }

    [Fact]
    public async Task A_model_with_an_unstable_pole_or_a_series_with_a_bad_line_is_refused_and_nothing_is_stored()
    {
        var (caseId, p, _) = await CaseWithStageAsync("T-CHAIN-3", null);
        var unstable = await app.AttachAsync(caseId, "chain.residual", "unstable.json", "{\"stages\": [{\"polesHz\": [[5, 0]], \"gain\": 1}]}");
        var badSeries = await app.AttachAsync(caseId, "chain.residual", "bad-output.txt", "gps_time value\n1400000000 0.1\n1400000000.5 oops\n");
        var service = app.Get<ChainCheckService>();

        var e1 = await Assert.ThrowsAsync<FormatException>(() => service.RunAsync(app.Reviewer, caseId, "chain.residual", p with { ModelSha = unstable }));
        Assert.Contains("'unstable.json'", e1.Message, StringComparison.Ordinal);
        Assert.Contains("unstable", e1.Message, StringComparison.Ordinal);
        var e2 = await Assert.ThrowsAsync<FormatException>(() => service.RunAsync(app.Reviewer, caseId, "chain.residual", p with { OutputShas = [badSeries] }));
        Assert.Contains("'bad-output.txt'", e2.Message, StringComparison.Ordinal);
        Assert.Contains("line 3", e2.Message, StringComparison.Ordinal);
        Assert.Empty((await app.Get<CaseQueries>().GetAsync(app.Reviewer, caseId)).Item("chain.residual").Computations);
    }
}
