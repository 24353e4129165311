using EventReview.Core.Antenna;
using EventReview.Core.Timing;

namespace EventReview.Web.Services.Checks;

/// <summary>What a timing computation record stores as its result.</summary>
public sealed record TimingRecordResult(TimingCheckResult Timing, AntennaConsistencyResult? Antenna);
