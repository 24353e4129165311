using System.Globalization;
using System.Security.Claims;
using EventReview.Core.Antenna;
using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Timing;
using EventReview.Web.Auth;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Runs the timing and antenna-response check on a case's arrivals with the network's sites and stores the result as a
/// computation record on the item. Re-running with the same inputs and parameters adds nothing (the record stands).
/// </summary>
public sealed class TimingCheckService(CaseService cases, NetworkService network)
{
    /// <summary>Runs the check; returns the updated case and whether a new record was added.</summary>
    /// <exception cref="ArgumentException">When inputs are unusable (fewer than two arrivals, unknown site, bad parameter).</exception>
    public async Task<(ReviewCase Case, bool Added)> RunAsync(ClaimsPrincipal user, int caseId, string itemKey, TimingCheckParameters parameters, CancellationToken ct = default)
    {
        Permissions.Require(user, Auth.Policies.Work, "run checks");
        parameters.Validate();
        var c = await cases.GetAsync(user, caseId, ct);
        var item = c.Item(itemKey);
        var sites = (await network.GetAsync(ct)).Sites.OrderBy(s => s.Code).ToList();
        var arrivals = c.Arrivals.OrderBy(a => a.SiteCode).Select(a => new SiteArrival(a.SiteCode, a.Arrival, a.Snr)).ToList();
        if (arrivals.Count < 2)
        {
            throw new ArgumentException($"The timing check needs arrivals at two or more sites; case {c.CandidateId} has {arrivals.Count}.", "arrivals");
        }

        var used = sites.Where(s => arrivals.Any(a => a.SiteCode == s.Code)).ToList();
        var inputs = new
        {
            sites = used.Select(s => new { s.Code, s.LatitudeDegrees, s.LongitudeDegrees, s.HeightMeters, s.XArmAzimuthDegrees, s.YArmAzimuthDegrees, s.TimingUncertaintySeconds }),
            arrivals = c.Arrivals.OrderBy(a => a.SiteCode).Select(a => new { a.SiteCode, a.ArrivalNanoseconds, a.Snr }),
        };
        var inputFingerprint = CheckRecords.Fingerprint(inputs);
        var parametersJson = CheckRecords.Serialize(parameters);
        var latest = item.Computations.Where(r => r.Kind == "timing").OrderByDescending(r => r.RunAt).ThenByDescending(r => r.Id).FirstOrDefault();
        if (latest is not null && latest.InputFingerprint == inputFingerprint && latest.ParametersJson == parametersJson && latest.ToolVersion == CheckRecords.ToolVersion)
        {
            return (c, false);
        }

        var timing = TimingCheck.Run(sites, arrivals, new TimingOptions(parameters.KSigma));
        AntennaConsistencyResult? antenna = null;
        IReadOnlyList<SkyCell>? cells = null;
        if (parameters.HasObservation)
        {
            var observation = new AntennaObservation(parameters.ObservedSign!.Value, parameters.ObservedAmplitudeRatio!.Value);
            var options = new AntennaConsistencyOptions(parameters.RatioTolerance);
            antenna = AntennaCheck.ForPair(sites, timing, parameters.PairA!, parameters.PairB!, observation, options);
            var a = sites.First(s => s.Code == parameters.PairA!.ToUpperInvariant());
            var b = sites.First(s => s.Code == parameters.PairB!.ToUpperInvariant());
            cells = AntennaSkyRegion.AllowedCells(a, b, observation, timing.GmstDegrees, 5, options);
        }

        var verdict = !timing.Consistent ? "inconsistent" : antenna is { FractionAllowingSignAndRatio: <= 0 } ? "inconsistent" : "consistent";
        var svg = SkyMapSvg.Render(used, timing, cells);
        var result = new TimingRecordResult(timing, antenna);
        var summary = Summarise(timing, antenna, parameters);
        var updated = await cases.AddComputationAsync(user, caseId, itemKey,
            now => new ComputationRecord("timing", parametersJson, inputFingerprint, CheckRecords.ToolVersion, CheckRecords.Serialize(result), verdict, summary, svg, user.ToActor(), now), ct);
        return (updated, true);
    }

    /// <summary>One line with the key numbers, units and the rule they were judged against.</summary>
    public static string Summarise(TimingCheckResult timing, AntennaConsistencyResult? antenna, TimingCheckParameters p)
    {
        var worst = timing.Pairs.OrderBy(x => x.MarginSeconds).First();
        var text = string.Create(CultureInfo.InvariantCulture,
            $"{timing.Pairs.Count(x => x.Consistent)} of {timing.Pairs.Count} pairs within window; tightest {worst.A}-{worst.B}: observed {worst.ObservedSeconds * 1e3:+0.00;-0.00} ms (allowed ±{worst.AllowedSeconds * 1e3:F2} ms: light-travel {worst.LightTravelSeconds * 1e3:F2} ms + {p.KSigma:0.#}σ timing).");
        if (antenna is not null)
        {
            text += string.Create(CultureInfo.InvariantCulture,
                $" Antenna response {antenna.A}/{antenna.B}: sign {(antenna.ObservedSign > 0 ? "+" : "−")}, ratio {antenna.ObservedAmplitudeRatio:0.##} allowed on {antenna.FractionAllowingSignAndRatio:P0} of the directions.");
        }

        return text;
    }
}
