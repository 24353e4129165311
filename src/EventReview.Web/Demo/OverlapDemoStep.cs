using System.Globalization;
using EventReview.Core.Evidence.Roles;
using EventReview.Core.Signal.Io;
using EventReview.Core.Signal.Simulation;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;

namespace EventReview.Web.Demo;

/// <summary>
/// Simulated strain for the three-site demo candidate (leading-order chirp of chirp mass 25 M☉, network SNR 28, coloured
/// Gaussian noise, fixed seed), attached to the overlap item as one text file per site, then the overlap check is run for
/// the two loudest sites so the case page shows the overlay, the correlation curve, the off-source histogram and the maps.
/// </summary>
public sealed class OverlapDemoStep(CaseQueries cases, EvidenceAppender appender, OverlapCheckService overlap) : IDemoSeedStep
{
    /// <summary>Candidate that gets simulated strain.</summary>
    public const string CandidateId = "ER-C-0142";

    /// <summary>Item the files and the record are attached to.</summary>
    public const string ItemKey = "morphology.overlap";

    /// <summary>Span simulated around the candidate (s) and sample rate (Hz): 32 s at 4096 Hz is ~6 MB of text per site.</summary>
    public const double DurationSeconds = 32;

    public const double SampleRateHz = 4096;

    public int Order => 40;

    public async Task SeedAsync(DemoContext demo, CancellationToken ct)
    {
        if (!demo.CaseIds.TryGetValue(CandidateId, out var caseId) || !demo.Candidates.TryGetValue(CandidateId, out var candidate))
        {
            return;
        }

        var projections = DemoSeeder.Project(candidate, demo.Sites)
            .Select(p => new SiteProjection(p.Code, p.DelaySeconds, p.FPlus, p.FCross)).ToList();
        var options = new SimulationOptions(candidate.Time.AddSeconds(-DurationSeconds / 2), DurationSeconds, SampleRateHz, Seed: 142,
            Chirp: new ChirpParameters(25, InclinationRad: 0.5, PhaseRad: 1.1), Coalescence: candidate.Time, NetworkSnr: 28);
        var sim = await Task.Run(() => NetworkSimulator.Simulate(projections, options), ct);
        foreach (var site in sim.Sites)
        {
            var truth = sim.Truth.Sites.First(t => t.Code == site.Code);
            using var buffer = new MemoryStream();
            await using (var writer = new StreamWriter(buffer, leaveOpen: true))
            {
                StrainTextWriter.Write(writer, site.Strain,
                [
                    $"simulated strain of demo site {site.Code} for {CandidateId} (invented data, seed {options.Seed})",
                    string.Create(CultureInfo.InvariantCulture, $"injected: chirp mass {sim.Truth.ChirpMassMsun} Msun, site SNR {truth.Snr:0.0}, arrival {truth.ArrivalGps}, F+ {truth.FPlus:0.###}, Fx {truth.FCross:0.###}"),
                ]);
            }

            buffer.Position = 0;
            await appender.AddAttachmentAsync(demo.ReviewerA, caseId, ItemKey, buffer, $"{site.Code}-strain.txt", "text/plain",
                $"Simulated strain at {site.Code}, {DurationSeconds:0} s at {SampleRateHz:0} Hz around the candidate (demo data).", long.MaxValue,
                new FileRole(FileRoleKind.Strain, site.Code), ct);
        }

        var c = await cases.GetAsync(demo.ReviewerA, caseId, ct);
        var defaults = await overlap.DefaultsAsync(c, null, null, 3, ct);
        var files = CaseFiles.List(c);
        string Sha(string? code) => files.First(f => f.FileName == $"{code}-strain.txt").Sha256;
        await overlap.RunAsync(demo.ReviewerA, caseId, ItemKey, new OverlapCheckParameters(new StrainPick(Sha(defaults.SiteA)), new StrainPick(Sha(defaults.SiteB))), null, ct);
    }
}
