using EventReview.Core.Injections;

namespace EventReview.Web.Services.Checks;

/// <summary>What an injections computation record stores as its result.</summary>
/// <param name="Format">Record format (<see cref="Core.Verdicts.RecordFormat"/>); 0 when read from a format-1 record.</param>
/// <param name="Source">"log" (an injection log looked up) or "sealed-record" (an opened blind-injection record).</param>
/// <param name="Report">Overlaps at every site, the times used, margin, verdict and assumptions.</param>
/// <param name="InjectionsRead">Rows in the log or record.</param>
/// <param name="Files">The log file (source "log"), empty for a sealed record.</param>
/// <param name="Seal">The seal that was opened (source "sealed-record"), else null.</param>
public sealed record InjectionRecordResult(int Format, string Source, InjectionOverlapReport Report, int InjectionsRead, IReadOnlyList<CheckFileRef> Files, SealInfo? Seal);

/// <summary>The seal behind a blind-injection comparison.</summary>
/// <param name="Id">Seal id in the tool.</param>
/// <param name="Label">Its label.</param>
/// <param name="Commitment">SHA-256(salt || record), lowercase hex.</param>
/// <param name="RecordSha256">SHA-256 of the opened record bytes.</param>
/// <param name="SealedBy">Who registered the seal.</param>
/// <param name="SealedAt">When it was registered (UTC).</param>
/// <param name="OpenedBy">Who opened it.</param>
/// <param name="OpenedAt">When it was opened (UTC).</param>
public sealed record SealInfo(int Id, string Label, string Commitment, string RecordSha256, string SealedBy, DateTimeOffset SealedAt, string OpenedBy, DateTimeOffset OpenedAt);
