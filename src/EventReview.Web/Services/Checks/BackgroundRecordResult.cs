namespace EventReview.Web.Services.Checks;

/// <summary>What a background computation record stores as its result.</summary>
/// <param name="Sites">Per site, the files read and the triggers dropped.</param>
/// <param name="Pairs">Per site pair, the background and its figures.</param>
/// <param name="HeadlinePair">Index in <paramref name="Pairs"/> of the pair quoted in the summary: the least significant (largest FAR), to stay conservative.</param>
/// <param name="Verdict">"consistent" or "concern" (any pair whose background time cannot reach 3σ).</param>
/// <param name="SecondsPerYear">Year used for "per year" rates (Julian year, 365.25 d).</param>
/// <param name="Method">How the numbers were made, with the method's source.</param>
public sealed record BackgroundRecordResult(IReadOnlyList<BackgroundSiteInput> Sites, IReadOnlyList<BackgroundPairRecord> Pairs, int HeadlinePair, string Verdict,
    double SecondsPerYear, IReadOnlyList<string> Method);
