namespace EventReview.Core.Verdicts;

/// <summary>
/// Version of the result a computation record stores (its JSON shape and the verdict words it may hold). The version is
/// written inside the result JSON as <c>"format"</c>, so it is covered by the record's content hash; a record without it
/// is format 1. Old records keep their format: they are drawn and verified as they were stored, never rewritten.
/// <list type="bullet">
/// <item>Format 1: verdict words "consistent", "inconsistent", "clear", "concern", the two legacy data-chain words
/// (<see cref="Verdict.NothingAdded"/>, <see cref="Verdict.SomethingAdded"/>), "no drift", "drift", "frozen".</item>
/// <item>Format 2 (this version) adds, for the data chain, "residual is noise", "excess found" and "model does not fit"
/// (replacing the two legacy data-chain words); for the background the significance bands "below 3 sigma",
/// "3 to 5 sigma", "5 sigma or more" and "at least 3 sigma" (replacing "consistent"), and a 90 % confidence FAR bound;
/// for veto safety the binomial statistic; the timing result carries its chi-square sky test and judgement, the overlap
/// result its lag uncertainty, phase and multi-resolution maps. The tool version of a format-2 record also names the
/// format ("(record format 2)"), for results (timing, overlap) that do not carry <c>"format"</c> themselves.</item>
/// </list>
/// </summary>
public static class RecordFormat
{
    /// <summary>The format this version writes.</summary>
    public const int Current = 2;

    /// <summary>The format of a record that stored no version.</summary>
    public const int Legacy = 1;

    /// <summary>The format of a stored result: <paramref name="stored"/> when it is set (&gt; 0), else <see cref="Legacy"/>.</summary>
    public static int Of(int? stored) => stored is > 0 ? stored.Value : Legacy;
}
