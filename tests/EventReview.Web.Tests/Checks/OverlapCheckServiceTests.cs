using System.Security.Claims;
using System.Text;
using System.Text.Json;
using EventReview.Core.Network;
using EventReview.Core.Signal.Io;
using EventReview.Core.Signal.Overlap;
using EventReview.Core.Signal.Simulation;
using EventReview.Core.Time;
using EventReview.Data;
using EventReview.Data.Auth;
using EventReview.Web.Auth;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Web.Tests.Checks;

/// <summary>The overlap check end to end: simulated strain attached to a case, run through the service, stored as a record.</summary>
public sealed class OverlapCheckServiceTests : IClassFixture<OverlapCheckServiceTests.App>
{
    private const string Item = "morphology.overlap";
    private static readonly GpsTime T0 = GpsTime.FromSeconds(1400000000.25m);
    private readonly App _app;

    public OverlapCheckServiceTests(App app) => _app = app;

    /// <summary>The app over its own SQLite folder, no demo data, with a two-site network.</summary>
    public sealed class App : WebApplicationFactory<Program>
    {
        private readonly string _dir = Directory.CreateTempSubdirectory("er-web-overlap-").FullName;

        public static Site[] Sites { get; } =
        [
            new("KX", "Site KX", 44, -101, 100, 62, 152, 1e-4),
            new("MV", "Site MV", 19, -71, 0, 117, 207, 1e-4),
        ];

        public ClaimsPrincipal Coordinator { get; } = new(new ClaimsIdentity(
        [
            new Claim(ClaimTypes.NameIdentifier, "test-coordinator"),
            new Claim(ClaimTypes.Name, "coordinator@test.invalid"),
            new Claim(UserClaims.DisplayName, "Test Coordinator"),
            new Claim(ClaimTypes.Role, Roles.Coordinator),
        ], "test"));

        protected override void ConfigureWebHost(IWebHostBuilder builder)
        {
            builder.UseSetting("EventReview:DataDirectory", _dir);
            builder.UseSetting("EventReview:SeedDemo", "false");
            builder.UseSetting("urls", "http://127.0.0.1:0");
        }

        public async Task EnsureNetworkAsync()
        {
            await using var db = await Services.GetRequiredService<Microsoft.EntityFrameworkCore.IDbContextFactory<AppDbContext>>().CreateDbContextAsync();
            if (!db.Networks.Any())
            {
                var net = new DetectorNetwork("test network");
                foreach (var s in Sites)
                {
                    net.Add(s);
                }

                db.Networks.Add(net);
                await db.SaveChangesAsync();
            }
        }

        protected override void Dispose(bool disposing)
        {
            base.Dispose(disposing);
            try
            {
                Directory.Delete(_dir, true);
            }
            catch (IOException)
            {
                // SQLite may still hold the file on some platforms; the temp folder is cleaned by the OS.
            }
        }
    }

    private sealed record Setup(int CaseId, string ShaA, string ShaB, SimulationResult Sim, IReadOnlyList<Core.Network.SiteProjection> Projection);

    /// <summary>A case with arrivals from an invented sky direction and simulated strain at both sites attached.</summary>
    private async Task<Setup> CaseWithStrainAsync(string candidateId, int seed, ChirpParameters? chirp, double snr)
    {
        await _app.EnsureNetworkAsync();
        using var scope = _app.Services.CreateScope();
        var cases = scope.ServiceProvider.GetRequiredService<CaseQueries>();
        var appender = scope.ServiceProvider.GetRequiredService<EvidenceAppender>();
        var workflow = scope.ServiceProvider.GetRequiredService<CaseWorkflow>();
        var gmst = Sidereal.GreenwichMeanSiderealDegrees(GpsUtc.ToUtc(T0));
        var projection = NetworkProjection.Project(App.Sites, SkyFrame.ToEcef(270.0, -30.0, gmst), 0.4);
        var arrivals = projection.Select((p, i) => new ArrivalRequest(p.Code, T0.AddSeconds(p.DelaySeconds).Nanoseconds / 1_000_000_000m, i == 0 ? 30.0 : 25.0)).ToList();
        var (c, _) = await workflow.OpenAsync(_app.Coordinator, new OpenCaseRequest(candidateId, T0.Nanoseconds / 1_000_000_000m, "test", "simulated", arrivals, "candidate-review"));
        var sim = NetworkSimulator.Simulate(projection.Select(p => new Core.Signal.Simulation.SiteProjection(p.Code, p.DelaySeconds, p.FPlus, p.FCross)).ToList(),
            new SimulationOptions(T0.AddSeconds(-8), 16, 2048, seed, chirp, T0, chirp is null ? null : snr));
        var shas = new List<string>();
        foreach (var s in sim.Sites)
        {
            var text = new StringWriter();
            StrainTextWriter.Write(text, s.Strain);
            var updated = await appender.AddAttachmentAsync(_app.Coordinator, c.Id, Item, new MemoryStream(Encoding.UTF8.GetBytes(text.ToString())), $"{s.Code}-strain.txt", "text/plain", "simulated", long.MaxValue);
            shas.Add(CaseFiles.List(updated).First(f => f.FileName == $"{s.Code}-strain.txt").Sha256);
        }

        return new Setup(c.Id, shas[0], shas[1], sim, projection);
    }

    [Fact]
    public async Task Overlap_check_on_simulated_strain_is_consistent_with_the_injected_lag_and_sign_and_a_rerun_adds_nothing()
    {
        // Edge-on (inclination 90 deg): both sites see the same waveform up to a sign, so the best lag is the arrival difference.
        var setup = await CaseWithStrainAsync("ER-T-0001", 7, new ChirpParameters(20, InclinationRad: Math.PI / 2), 60);
        using var scope = _app.Services.CreateScope();
        var service = scope.ServiceProvider.GetRequiredService<OverlapCheckService>();
        var parameters = new OverlapCheckParameters(new StrainPick(setup.ShaA), new StrainPick(setup.ShaB));
        var fractions = new List<double?>();
        var (c, added, summary) = await service.RunAsync(_app.Coordinator, setup.CaseId, Item, parameters, (f, _) => fractions.Add(f));

        Assert.True(added);
        var record = Assert.Single(c.Item(Item).Computations);
        Assert.Equal("overlap", record.Kind);
        Assert.True(record.Verdict == "consistent", summary);
        var result = JsonSerializer.Deserialize<OverlapReviewResult>(record.ResultJson, CheckRecords.Json)!;
        Assert.Equal("KX", result.SiteA); // loudest arrival
        Assert.Equal("MV", result.SiteB);
        double truthLag = setup.Projection[0].DelaySeconds - setup.Projection[1].DelaySeconds;
        Assert.True(Math.Abs(truthLag - result.Overlap.RefinedLagSeconds) <= 3 * result.Overlap.LagUncertaintySeconds!.Value, summary); // simulator truth, within 3σ
        Assert.Contains(" ± ", summary); // the lag is reported with its uncertainty
        Assert.Equal(setup.Sim.Truth.Sites[1].SignRelativeToFirst, result.Overlap.Sign);
        Assert.True(result.Overlap.Overlap >= 0.7, summary); // loud (network SNR 60) edge-on signal: well above the 0.5 default threshold
        Assert.Equal(1.0 / 201, result.Overlap.PValue!.Value, 1e-12); // no off-source window reaches the candidate: (1 + 0) / (1 + 200)

        // Allowed lag = light-travel + 3 sigma: sigma = sqrt(2) * 0.1 ms.
        double travel = Core.Geodesy.Baseline.Between(App.Sites[0], App.Sites[1]).LightTravelSeconds;
        Assert.Equal(travel + (3 * Math.Sqrt(2) * 1e-4), result.AllowedLagSeconds, 1e-12);
        Assert.Contains("±", summary);
        Assert.Contains("200 off-source trials", summary);
        Assert.Equal(8, record.PicturesSvg.Split(CheckRecords.PictureSeparator).Length); // overlay, curve, histogram, two Q maps and their zooms, the spectral densities
        Assert.Contains("Amplitude spectral density of KX and MV", record.PicturesSvg, StringComparison.Ordinal);
        Assert.Equal(record.Verdict, result.Judgement!.Word);
        Assert.Contains("light-travel KX–MV", result.AllowedLagRule);
        Assert.All(result.Maps, m => Assert.True(m.Fit is { ChirpLike: true }, m.Fit?.Reason ?? m.Error));
        Assert.Equal(fractions.Order().ToList(), fractions); // progress only moves forward

        var (again, addedAgain, _) = await service.RunAsync(_app.Coordinator, setup.CaseId, Item, parameters);
        Assert.False(addedAgain);
        Assert.Single(again.Item(Item).Computations);
    }

    [Fact]
    public async Task Overlap_check_on_noise_alone_is_not_consistent()
    {
        var setup = await CaseWithStrainAsync("ER-T-0002", 8, null, 0);
        using var scope = _app.Services.CreateScope();
        var service = scope.ServiceProvider.GetRequiredService<OverlapCheckService>();
        var (c, added, summary) = await service.RunAsync(_app.Coordinator, setup.CaseId, Item,
            new OverlapCheckParameters(new StrainPick(setup.ShaA), new StrainPick(setup.ShaB), OffSourceTrials: 100));
        Assert.True(added);
        Assert.Equal("inconsistent", Assert.Single(c.Item(Item).Computations).Verdict);
        Assert.Contains("100 off-source trials", summary);
    }

    [Fact]
    public async Task A_malformed_strain_file_gives_an_error_naming_the_file_and_line_and_stores_nothing()
    {
        var setup = await CaseWithStrainAsync("ER-T-0003", 9, new ChirpParameters(20), 30);
        using var scope = _app.Services.CreateScope();
        var cases = scope.ServiceProvider.GetRequiredService<CaseQueries>();
        var appender = scope.ServiceProvider.GetRequiredService<EvidenceAppender>();
        var workflow = scope.ServiceProvider.GetRequiredService<CaseWorkflow>();
        var bad = "# broken file\ngps_time value\n1400000000 1e-21\n1400000000.00048828125 2e-21\n1400000000.0009765625 oops\n";
        var c = await appender.AddAttachmentAsync(_app.Coordinator, setup.CaseId, Item, new MemoryStream(Encoding.UTF8.GetBytes(bad)), "broken.txt", "text/plain", "bad", long.MaxValue);
        var badSha = CaseFiles.List(c).First(f => f.FileName == "broken.txt").Sha256;
        var service = scope.ServiceProvider.GetRequiredService<OverlapCheckService>();

        var ex = await Assert.ThrowsAnyAsync<FormatException>(() => service.RunAsync(_app.Coordinator, setup.CaseId, Item,
            new OverlapCheckParameters(new StrainPick(setup.ShaA), new StrainPick(badSha))));
        Assert.Contains("broken.txt", ex.Message);
        Assert.Contains("line 5", ex.Message);
        var after = await cases.GetAsync(_app.Coordinator, setup.CaseId);
        Assert.Empty(after.Item(Item).Computations);
    }

    [Fact]
    public async Task An_hdf5_strain_file_with_timing_given_by_hand_reads_like_the_text_file()
    {
        var setup = await CaseWithStrainAsync("ER-T-0005", 7, new ChirpParameters(20, InclinationRad: Math.PI / 2), 60);
        var b = setup.Sim.Sites[1].Strain;
        var path = Path.Combine(Path.GetTempPath(), $"er-web-h5-{Guid.NewGuid():N}.h5");
        new PureHDF.H5File { ["strain"] = new PureHDF.H5Dataset(b.Samples) }.Write(path);
        using var scope = _app.Services.CreateScope();
        var cases = scope.ServiceProvider.GetRequiredService<CaseQueries>();
        var appender = scope.ServiceProvider.GetRequiredService<EvidenceAppender>();
        var workflow = scope.ServiceProvider.GetRequiredService<CaseWorkflow>();
        var c = await appender.AddAttachmentAsync(_app.Coordinator, setup.CaseId, Item, new MemoryStream(await File.ReadAllBytesAsync(path)), "MV-strain.h5", "application/x-hdf5", "hdf5", long.MaxValue);
        File.Delete(path);
        var h5 = CaseFiles.List(c).First(f => f.FileName == "MV-strain.h5").Sha256;
        var service = scope.ServiceProvider.GetRequiredService<OverlapCheckService>();

        var (fromText, _, _) = await service.RunAsync(_app.Coordinator, setup.CaseId, Item, new OverlapCheckParameters(new StrainPick(setup.ShaA), new StrainPick(setup.ShaB), OffSourceTrials: 0));
        var (fromH5, added, _) = await service.RunAsync(_app.Coordinator, setup.CaseId, Item,
            new OverlapCheckParameters(new StrainPick(setup.ShaA), new StrainPick(h5, "/strain", b.Start.Nanoseconds / 1_000_000_000m, b.SampleRateHz), OffSourceTrials: 0));
        Assert.True(added); // another input file: a new record
        var text = JsonSerializer.Deserialize<OverlapReviewResult>(fromText.Item(Item).Computations[0].ResultJson, CheckRecords.Json)!;
        var hdf = JsonSerializer.Deserialize<OverlapReviewResult>(fromH5.Item(Item).Computations[^1].ResultJson, CheckRecords.Json)!;
        Assert.Equal("MV-strain.h5", hdf.FileB);
        Assert.Equal(text.Overlap.RefinedLagSeconds, hdf.Overlap.RefinedLagSeconds, 1e-12); // same samples, same timing
        Assert.Equal(text.Overlap.Overlap, hdf.Overlap.Overlap, 1e-12);

        var ex = await Assert.ThrowsAnyAsync<FormatException>(() => service.RunAsync(_app.Coordinator, setup.CaseId, Item,
            new OverlapCheckParameters(new StrainPick(setup.ShaA), new StrainPick(h5, "/nothing-here", 1m, 2048))));
        Assert.Contains("MV-strain.h5", ex.Message);
        Assert.Contains("/nothing-here", ex.Message);
    }

    [Fact]
    public async Task Started_as_a_job_the_check_reports_what_it_stored()
    {
        var setup = await CaseWithStrainAsync("ER-T-0004", 10, new ChirpParameters(20, InclinationRad: Math.PI / 2), 60);
        using var scope = _app.Services.CreateScope();
        var service = scope.ServiceProvider.GetRequiredService<OverlapCheckService>();
        var job = service.Start(_app.Coordinator, setup.CaseId, Item, new OverlapCheckParameters(new StrainPick(setup.ShaA), new StrainPick(setup.ShaB), OffSourceTrials: 50));
        for (int i = 0; i < 600 && job.IsRunning; i++)
        {
            await Task.Delay(100);
        }

        Assert.False(job.IsRunning);
        Assert.True(job.Error is null, job.Error);
        Assert.StartsWith("stored: KX–MV: overlap", job.Result);
        var c = await scope.ServiceProvider.GetRequiredService<CaseQueries>().GetAsync(_app.Coordinator, setup.CaseId);
        Assert.Single(c.Item(Item).Computations);
    }
}
