using System.Globalization;
using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Environment;
using EventReview.Core.Evidence;
using EventReview.Core.Injections;
using EventReview.Core.Signal;
using EventReview.Core.Signal.Io;
using EventReview.Core.Time;
using EventReview.Core.Verdicts;
using EventReview.Web.Auth;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Runs the environment and veto lookup on files attached to a case (data-quality segments, triggers, optional sensor
/// inventory, injection log and coupling functions) around each site's arrival time and stores the result as a
/// computation record on the item. Every file is parsed and checked before anything is stored; re-running with the same
/// inputs and parameters adds nothing.
/// </summary>
public sealed class EnvironmentCheckService(CaseQueries cases, CaseWorkflow workflow, NetworkService network, CaseFiles files)
{
    /// <summary>Runs the check; returns the updated case and whether a new record was added.</summary>
    /// <exception cref="ArgumentException">A missing pick or a parameter out of range (message names it).</exception>
    /// <exception cref="FormatException">A file that does not parse (message names the file and the line).</exception>
    public async Task<(ReviewCase Case, bool Added)> RunAsync(ClaimsPrincipal user, int caseId, string itemKey, EnvironmentCheckParameters parameters, CancellationToken ct = default)
    {
        Permissions.Require(user, Policies.Work, "run checks");
        ArgumentNullException.ThrowIfNull(parameters);
        parameters.Validate();
        var c = await cases.GetAsync(user, caseId, ct);
        var item = c.Item(itemKey);
        var attached = CaseFiles.List(c);
        var net = await network.GetAsync(ct);
        var known = net.Sites.Select(s => s.Code).ToList();
        var notes = new List<string>();
        var refs = new List<CheckFileRef>();

        var (segments, segFile) = await CheckInputs.ReadTextAsync(files, attached, parameters.SegmentsSha, "data-quality segments", r => DataQualitySegmentCsv.Parse(r, known), ct);
        refs.Add(segFile);
        notes.AddRange(segments.Notes.Select(n => $"{segFile.FileName}: {n}"));
        var (triggers, trigFile) = await CheckInputs.ReadTextAsync(files, attached, parameters.TriggersSha, "triggers", r => AuxiliaryTriggerCsv.Parse(r, known), ct);
        refs.Add(trigFile);
        IReadOnlyList<Sensor> sensors = [];
        if (parameters.InventorySha is not null)
        {
            (sensors, var f) = await CheckInputs.ReadTextAsync(files, attached, parameters.InventorySha, "sensor inventory", r => SensorInventoryCsv.Parse(r, known), ct);
            refs.Add(f);
        }
        else
        {
            notes.Add("no sensor inventory given: every channel is of kind 'other' and no coupling function is used");
        }

        VetoSafetyReport? safety = null;
        if (parameters.InjectionsSha is not null)
        {
            var (log, f) = await CheckInputs.ReadTextAsync(files, attached, parameters.InjectionsSha, "injection log", r => InjectionLogCsv.Parse(r, known), ct);
            refs.Add(f);
            safety = VetoSafety.Evaluate(triggers, log, new VetoSafetyOptions(WindowSeconds: parameters.WindowSeconds));
        }
        else
        {
            notes.Add("no injection log given: veto safety of every channel is unknown");
        }

        var coupling = new Dictionary<string, FrequencyTable>(StringComparer.Ordinal);
        foreach (var sensor in sensors.Where(s => s.CouplingFile is not null))
        {
            var match = attached.FirstOrDefault(a => string.Equals(a.FileName, sensor.CouplingFile, StringComparison.OrdinalIgnoreCase));
            if (match is null)
            {
                notes.Add($"coupling file '{sensor.CouplingFile}' named for {ChannelName.Qualified(sensor.Site, sensor.Channel)} is not attached to this case: no coupling estimate for it");
                continue;
            }

            var (table, f) = await CheckInputs.ReadTextAsync(files, attached, match.Sha256, $"coupling function of {ChannelName.Qualified(sensor.Site, sensor.Channel)}", r => FrequencyTable.Parse(r, "coupling"), ct);
            refs.Add(f);
            coupling[ChannelName.Qualified(sensor.Site, sensor.Channel)] = table;
        }

        var arrivals = c.Arrivals.ToDictionary(a => a.SiteCode, a => a.Arrival, StringComparer.OrdinalIgnoreCase);
        var siteCodes = arrivals.Keys.Select(k => k.ToUpperInvariant()).Concat(segments.Segments.Select(s => s.Site)).Concat(triggers.Select(t => t.Site))
            .Distinct().Order(StringComparer.Ordinal).ToList();
        var (lightTravel, lightSource) = CrossSiteWindow.Choose(net.Sites, siteCodes, parameters.LightTravelWindowSeconds);
        var strain = new Dictionary<string, TimeSeries>(StringComparer.Ordinal);
        foreach (var (site, sha) in (parameters.StrainShas ?? new Dictionary<string, string>()).OrderBy(kv => kv.Key, StringComparer.Ordinal))
        {
            var (series, f) = await CheckInputs.ReadTextAsync(files, attached, sha, $"strain of {site.ToUpperInvariant()}", r => StrainTextReader.Read(r), ct);
            strain[site.ToUpperInvariant()] = series;
            refs.Add(f);
        }

        var sensorData = new Dictionary<string, TimeSeries>(StringComparer.Ordinal);
        foreach (var sensor in sensors.Where(s => s.DataFile is not null))
        {
            var match = attached.FirstOrDefault(a => string.Equals(a.FileName, sensor.DataFile, StringComparison.OrdinalIgnoreCase));
            if (match is null)
            {
                notes.Add($"sensor data file '{sensor.DataFile}' named for {ChannelName.Qualified(sensor.Site, sensor.Channel)} is not attached to this case: its typed noise amplitude is used");
                continue;
            }

            var (series, f) = await CheckInputs.ReadTextAsync(files, attached, match.Sha256, $"data of {ChannelName.Qualified(sensor.Site, sensor.Channel)}", r => StrainTextReader.Read(r), ct);
            sensorData[ChannelName.Qualified(sensor.Site, sensor.Channel)] = series;
            refs.Add(f);
        }

        var inputs = new
        {
            caseGps = c.GpsNanoseconds,
            arrivals = c.Arrivals.OrderBy(a => a.SiteCode).Select(a => new { a.SiteCode, a.ArrivalNanoseconds }),
            sites = net.Sites.Where(s => siteCodes.Contains(s.Code)).OrderBy(s => s.Code).Select(s => new { s.Code, s.LatitudeDegrees, s.LongitudeDegrees, s.HeightMeters }),
            files = refs.Select(r => new { r.Role, r.Sha256 }),
        };
        var fingerprint = CheckRecords.Fingerprint(inputs);
        var parametersJson = CheckRecords.Serialize(parameters);
        var latest = CheckRecords.Latest(item.Computations, Core.Checklists.CheckKind.Environment);
        if (CheckRecords.SameRun(latest, fingerprint, parametersJson))
        {
            return (c, false);
        }

        var couplingOptions = Coupling(parameters, coupling.Count > 0, strain, sensorData, site => arrivals.TryGetValue(site, out var t) ? t : c.Gps, notes);
        var input = new EnvironmentLookupInput(c.Gps, arrivals, siteCodes, segments.Segments, triggers, sensors, safety, coupling.Count > 0 ? coupling : null);
        var options = new EnvironmentLookupOptions(parameters.WindowSeconds, parameters.KindWindows(), parameters.RateWindowSeconds, lightTravel, couplingOptions);
        var report = EnvironmentLookup.Run(input, options);
        var result = new EnvironmentRecordResult(RecordFormat.Current, report, safety, lightTravel, lightSource, notes, refs);
        var svg = Core.Plots.PlotSvg.Write(Core.Plots.Figures.EnvironmentTimelineFigure.Build(report, parameters.WindowSeconds));
        var summary = Summarise(report, parameters);
        var updated = await workflow.AddComputationAsync(user, caseId, itemKey,
            now => new ComputationRecord(Core.Checklists.CheckKind.Environment, parametersJson, fingerprint, CheckRecords.ToolVersion, CheckRecords.Serialize(result),
                report.Judgement.Word, summary, svg, user.ToActor(), now), ct);
        return (updated, true);
    }

    /// <summary>One line: per-site verdict with its hit and segment counts, and the windows used.</summary>
    public static string Summarise(EnvironmentReport report, EnvironmentCheckParameters p)
    {
        var sites = string.Join("; ", report.Sites.Select(s =>
        {
            var hits = report.Hits.Count(h => h.Site == s.Site);
            var segs = report.Segments.Count(g => g.Site == s.Site);
            return $"{s.Site} {s.Judgement.Word}" + (hits + segs > 0 ? $" ({hits} trigger(s), {segs} DQ segment(s))" : string.Empty);
        }));
        return string.Create(CultureInfo.InvariantCulture,
            $"{sites}. Window ±{p.WindowSeconds:0.###} s around each arrival, rates over {p.RateWindowSeconds:0} s; {report.Coincidences.Count} cross-site coincidence(s).");
    }

    /// <summary>The coupling settings: typed numbers, with the amplitudes read from strain and sensor data where given; null when no candidate amplitude is known anywhere.</summary>
    private static CouplingOptions? Coupling(EnvironmentCheckParameters p, bool haveFunctions, Dictionary<string, TimeSeries> strain, Dictionary<string, TimeSeries> sensorData,
        Func<string, GpsTime> arrivalOf, List<string> notes)
    {
        if (p.CandidateStrainAmplitude is null && strain.Count == 0)
        {
            if (haveFunctions)
            {
                notes.Add("coupling functions found but neither the candidate's strain amplitude nor strain data was given: coupling not estimated");
            }

            return null;
        }

        var typed = new CouplingOptions(p.CandidateStrainAmplitude, p.CouplingBandLowHz, p.CouplingBandHighHz, p.CouplingFraction, p.SensorNoiseAmplitude);
        var (options, read) = CouplingMeasurement.FromData(typed, strain, sensorData, arrivalOf);
        notes.AddRange(read);
        if (p.SensorNoiseAmplitude is null && sensorData.Count == 0)
        {
            notes.Add("no typical sensor noise amplitude and no sensor data given: coupling can only be estimated where a measured sensor spectrum exists (none here)");
        }

        return options;
    }
}
