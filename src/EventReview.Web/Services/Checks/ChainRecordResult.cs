using EventReview.Core.Chain;

namespace EventReview.Web.Services.Checks;

/// <summary>What a chain computation record stores: the report (per stage) and the input files with their roles.</summary>
public sealed record ChainRecordResult(DataChainReport Report, IReadOnlyList<CheckFileRef> Files);
