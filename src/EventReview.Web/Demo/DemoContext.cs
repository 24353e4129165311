using System.Security.Claims;
using EventReview.Core.Network;
using EventReview.Core.Time;

namespace EventReview.Web.Demo;

/// <summary>What demo seed steps need: the demo people, the cases by candidate id, the sites, the candidate times.</summary>
public sealed record DemoContext(
    ClaimsPrincipal Coordinator,
    ClaimsPrincipal ReviewerA,
    ClaimsPrincipal ReviewerB,
    IReadOnlyDictionary<string, int> CaseIds,
    IReadOnlyList<Site> Sites,
    IReadOnlyDictionary<string, DemoCandidate> Candidates);

/// <summary>The invented truth behind a demo candidate: time, sky direction and polarisation used to make its arrivals.</summary>
public sealed record DemoCandidate(string CandidateId, GpsTime Time, double RaDegrees, double DecDegrees, double PsiRadians, IReadOnlyList<string> SiteCodes, IReadOnlyList<double> Snrs);
