using EventReview.Core.Configuration;

namespace EventReview.Web.Services.Checks;

/// <summary>What a configuration drift record stores (record format 2; format-1 records stored the bare drift report).</summary>
/// <param name="Format">Record format (<see cref="Core.Verdicts.RecordFormat"/>).</param>
/// <param name="Report">The drift of the later snapshot against the frozen one, with its judgement.</param>
public sealed record DriftRecordResult(int Format, DriftReport Report);
