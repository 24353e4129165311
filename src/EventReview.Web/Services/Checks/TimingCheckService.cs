using System.Security.Claims;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Evidence;
using EventReview.Core.Timing;
using EventReview.Web.Auth;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Gathers a case's arrivals and the network's sites, runs the timing check kind in Core (<see cref="TimingReview"/>: timing, sky
/// chi-square and the optional antenna-response test) and stores its result as a computation record on the item. Re-running with
/// the same inputs, parameters and tool version adds nothing (<see cref="CheckRecords.SameRun"/>).
/// </summary>
public sealed class TimingCheckService(CaseQueries cases, CaseWorkflow workflow, NetworkService network)
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
        if (CheckRecords.SameRun(CheckRecords.Latest(item.Computations, CheckKind.Timing), inputFingerprint, parametersJson))
        {
            return (c, false);
        }

        var result = TimingReview.Run(sites, arrivals, parameters);
        var updated = await workflow.AddComputationAsync(user, caseId, itemKey,
            now => new ComputationRecord(CheckKind.Timing, parametersJson, inputFingerprint, CheckRecords.ToolVersion, CheckRecords.Serialize(result),
                result.Judgement!.Word, result.Summary, result.PictureSvg, user.ToActor(), now), ct);
        return (updated, true);
    }
}
