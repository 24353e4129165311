using System.Security.Claims;
using System.Text;
using EventReview.Core.Evidence.Roles;
using EventReview.Core.Injections;
using EventReview.Core.Time;
using EventReview.Web.Services;
using EventReview.Web.Services.Checks;

namespace EventReview.Web.Demo;

/// <summary>
/// Demo data for the local-causes checks (invented scenario). ER-C-0142: a magnetic and a mains trigger 0.18 s before
/// the arrival at site AB (environment: concern at AB, clear elsewhere; the magnetometer's coupling is read from its own
/// series and the candidate's strain at AB, and stays a few per cent of the signal), an injection log with nothing near
/// the candidate (clear; each site's actuator readback fires at every injection and is unsafe as a veto), one data-chain
/// stage whose residual is its quantisation noise, and a registered sealed blind-injection record whose record and salt
/// are given in a demo-only note on injection.blind-open. ER-C-0157: environment files with nothing near (clear).
/// Runs after the overlap step so that the strain files it attaches can be read.
/// </summary>
public sealed class LocalCausesDemoStep(CaseQueries cases, EvidenceAppender appender, EnvironmentCheckService environment, InjectionCheckService injections,
    ChainCheckService chain, SealedRecordService seals) : IDemoSeedStep
{
    /// <summary>The fixed demo salt (32 bytes, hex). Demo only: a real salt is random and secret until opening.</summary>
    public const string DemoSalt = "5eed0f1e2d3c4b5a69788796a5b4c3d2e1f00112233445566778899aabbccdd0";

    public int Order => 45;

    public async Task SeedAsync(DemoContext demo, CancellationToken ct)
    {
        await SeedReviewCaseAsync(demo, ct);
        await SeedTriageCaseAsync(demo, ct);
    }

    private async Task SeedReviewCaseAsync(DemoContext demo, CancellationToken ct)
    {
        var id = demo.CaseIds["ER-C-0142"];
        var who = demo.ReviewerA;
        var c = await cases.GetAsync(who, id, ct);
        var arrivals = c.Arrivals.ToDictionary(a => a.SiteCode, a => a.Arrival);
        var sites = arrivals.Keys.Order(StringComparer.Ordinal).ToList();
        var segments = await Attach(who, id, "state.dq-segments", "dq-segments-ER-C-0142.csv", FileRoleKind.DataQualitySegments, LocalCausesDemoFiles.Segments(c.Gps, sites), "Data-quality segments of the three sites, ±2 h (invented demo data).", ct);
        var triggers = await Attach(who, id, "env.triggers", "triggers-ER-C-0142.csv", FileRoleKind.AuxiliaryTriggers, LocalCausesDemoFiles.Triggers(c.Gps, arrivals, "AB", 142), "Auxiliary and environmental triggers, ±1 h (invented demo data).", ct);
        var inventory = await Attach(who, id, "env.triggers", "sensor-inventory.csv", FileRoleKind.SensorInventory, LocalCausesDemoFiles.Inventory(sites, "AB"), "Sensor inventory of the three sites (invented).", ct);
        await Attach(who, id, "env.coupling", LocalCausesDemoFiles.CouplingFileName("AB"), FileRoleKind.CouplingFunction, LocalCausesDemoFiles.MagneticCoupling(), "Magnetic coupling function of AB's vault magnetometer, strain per tesla (invented).", ct);
        await Attach(who, id, "env.coupling", LocalCausesDemoFiles.SensorDataFileName("AB"), FileRoleKind.SensorSeries, LocalCausesDemoFiles.MagnetometerSeries(c.Gps, arrivals["AB"], 1421), "AB vault magnetometer, 32 s at 512 Hz around the candidate, tesla (invented demo data).", ct);
        var log = await Attach(who, id, "injection.system-records", "injection-log-ER-C-0142.csv", FileRoleKind.InjectionLog, LocalCausesDemoFiles.InjectionLog(c.Gps, sites), "Injection log of the three sites, ±2 h (invented demo data).", ct);

        var strain = CaseFiles.List(await cases.GetAsync(who, id, ct)).FirstOrDefault(f => f.FileName == "AB-strain.txt")?.Sha256;
        var p = DemoEnvironmentParameters(segments, triggers, inventory, log) with { StrainShas = strain is null ? null : new Dictionary<string, string> { ["AB"] = strain } };
        foreach (var item in new[] { "env.triggers", "env.veto-safety", "env.coupling", "state.dq-segments" })
        {
            await environment.RunAsync(who, id, item, p, ct);
        }

        await injections.RunLogAsync(who, id, "injection.system-records", new InjectionCheckParameters(log), ct);

        var (input, output) = LocalCausesDemoFiles.ChainStage(c.Gps, 1420);
        var model = await Attach(who, id, "chain.residual", "chain-stage1-model.json", FileRoleKind.StageModel, LocalCausesDemoFiles.StageModelJson(), "Stage model: two-pole low-pass at 100 Hz (invented).", ct);
        var x = await Attach(who, id, "chain.residual", "chain-stage1-input.txt", FileRoleKind.StageInput, input, "Stage 1 recorded input, 32 s at 512 Hz (invented demo data).", ct);
        var y = await Attach(who, id, "chain.residual", "chain-stage1-output.txt", FileRoleKind.StageOutput, output, "Stage 1 recorded output (invented demo data).", ct);
        await chain.RunAsync(who, id, "chain.residual", new ChainCheckParameters(x, [y], model), null, ct);

        var record = LocalCausesDemoFiles.BlindRecord(c.Gps);
        var commitment = SealedRecord.Commitment(Convert.FromHexString(DemoSalt), record);
        await seals.RegisterAsync(demo.Coordinator, commitment, "Demo blind injections, current observing period", id, "injection.blind-seal", ct);
        await appender.AddNoteAsync(demo.Coordinator, id, "injection.blind-open",
            "**Demo only** — in a real review the record and salt stay with their holders until the end. To try opening the sealed record, pick the attached " +
            "`blind-record-DEMO.csv` (or paste the record below exactly, without a final newline) and enter the salt:\n\n" +
            $"```\n{Encoding.UTF8.GetString(record)}\n```\n\nSalt: `{DemoSalt}`", ct);
        await Attach(demo.Coordinator, id, "injection.blind-open", "blind-record-DEMO.csv", FileRoleKind.BlindInjectionRecord, Encoding.UTF8.GetString(record), "Demo only: the sealed blind-injection record (normally kept by its holders until opening).", ct);
    }

    private async Task SeedTriageCaseAsync(DemoContext demo, CancellationToken ct)
    {
        var id = demo.CaseIds["ER-C-0157"];
        var who = demo.ReviewerA;
        var c = await cases.GetAsync(who, id, ct);
        var arrivals = c.Arrivals.ToDictionary(a => a.SiteCode, a => a.Arrival);
        var sites = arrivals.Keys.Order(StringComparer.Ordinal).ToList();
        var segments = await Attach(who, id, "triage.state", "dq-segments-ER-C-0157.csv", FileRoleKind.DataQualitySegments, LocalCausesDemoFiles.Segments(c.Gps, sites), "Data-quality segments, ±2 h (invented demo data).", ct);
        var triggers = await Attach(who, id, "triage.environment", "triggers-ER-C-0157.csv", FileRoleKind.AuxiliaryTriggers, LocalCausesDemoFiles.Triggers(c.Gps, arrivals, null, 157), "Auxiliary and environmental triggers, ±1 h (invented demo data).", ct);
        var inventory = await Attach(who, id, "triage.environment", "sensor-inventory.csv", FileRoleKind.SensorInventory, LocalCausesDemoFiles.Inventory(sites, null), "Sensor inventory (invented).", ct);
        var log = await Attach(who, id, "triage.injections", "injection-log-ER-C-0157.csv", FileRoleKind.InjectionLog, LocalCausesDemoFiles.InjectionLog(c.Gps, sites), "Injection log, ±2 h (invented demo data).", ct);
        var p = DemoEnvironmentParameters(segments, triggers, inventory, log) with { CandidateStrainAmplitude = null, SensorNoiseAmplitude = null };
        await environment.RunAsync(who, id, "triage.environment", p, ct);
        await environment.RunAsync(who, id, "triage.state", p, ct);
        await injections.RunLogAsync(who, id, "triage.injections", new InjectionCheckParameters(log), ct);
    }

    /// <summary>The demo's environment parameters: ±1 s (±10 s for seismic and weather), 1 h rates, coupling against a 1e-21 strain with 10 pT sensor noise.</summary>
    public static EnvironmentCheckParameters DemoEnvironmentParameters(string segments, string triggers, string? inventory, string? log) =>
        new(segments, triggers, inventory, log, 1.0, new SortedDictionary<string, double> { ["seismic"] = 10, ["weather"] = 10 }, 3600, null, 0.1, 1e-21, 20, 500, 1e-11);

    private async Task<string> Attach(ClaimsPrincipal who, int caseId, string item, string name, FileRoleKind role, string text, string description, CancellationToken ct)
    {
        var bytes = Encoding.UTF8.GetBytes(text);
        await using var stream = new MemoryStream(bytes);
        var contentType = name.EndsWith(".json", StringComparison.Ordinal) ? "application/json" : name.EndsWith(".csv", StringComparison.Ordinal) ? "text/csv" : "text/plain";
        await appender.AddAttachmentAsync(who, caseId, item, stream, name, contentType, description, long.MaxValue, new FileRole(role), ct);
        return Core.Evidence.Hashing.Sha256Hex(bytes);
    }
}
