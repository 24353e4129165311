using EventReview.Core.Chain;

namespace EventReview.Web.Services.Checks;

/// <summary>What a chain computation record stores: the report (per stage) and the input files with their roles.</summary>
/// <param name="Format">Record format (<see cref="Core.Verdicts.RecordFormat"/>); 0 when read from a format-1 record.</param>
/// <param name="Report">The check's report.</param>
/// <param name="Files">Every input file with its role and SHA-256.</param>
public sealed record ChainRecordResult(int Format, DataChainReport Report, IReadOnlyList<CheckFileRef> Files);
