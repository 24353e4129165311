using System.Text.Json;
using EventReview.Core.Evidence;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Timing;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;

namespace EventReview.Web.Demo;

/// <summary>
/// Runs the timing check on the three-site demo candidate, with the antenna-response test of the sign the overlap check found
/// between AB and KP (only when that check could tell the sign) and an amplitude ratio typed in from the two sites' SNRs (the demo's
/// sites share one noise spectrum, so their SNR ratio stands in for the amplitude ratio).
/// </summary>
public sealed class TimingDemoStep(TimingCheckService timing, CaseQueries cases, EvidenceAppender appender) : IDemoSeedStep
{
    public int Order => 50;

    public async Task SeedAsync(DemoContext demo, CancellationToken ct)
    {
        var id = demo.CaseIds["ER-C-0142"];
        var c = await cases.GetAsync(demo.ReviewerA, id, ct);
        var record = c.Item("morphology.overlap").LatestComputation;
        var overlap = record is null ? null : JsonSerializer.Deserialize<OverlapReviewResult>(record.ResultJson, CheckRecords.Json)?.Overlap;
        var snr = c.Arrivals.ToDictionary(a => a.SiteCode, a => a.Snr);
        var ratio = Math.Round(snr["KP"] / snr["AB"], 2);
        if (overlap is { SignDetermined: true })
        {
            var sign = overlap.Sign;
            await appender.AddNoteAsync(demo.ReviewerA, id, "antenna.response",
                $"Observed relation between the sites for the antenna-response test: sign {(sign < 0 ? "−1 (flipped)" : "+1")} from the overlap check (item morphology.overlap); " +
                $"amplitude ratio |h(KP)|/|h(AB)| ≈ {ratio:0.00}, typed in from the SNR ratio (demo sites share one noise spectrum).", ct);
            await timing.RunAsync(demo.ReviewerA, id, "antenna.response", new TimingCheckParameters(3.0, "AB", "KP", sign, ratio, 0.3), ct);
        }
        else
        {
            await appender.AddNoteAsync(demo.ReviewerA, id, "antenna.response",
                "The overlap check could not tell the relative sign of AB and KP (phase near ±90° or too uncertain), so the antenna-response test waits for a sign from another source.", ct);
        }

        await timing.RunAsync(demo.ReviewerA, id, "timing.arrival", new TimingCheckParameters(), ct);
    }
}
