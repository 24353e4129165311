namespace EventReview.Core.Chain;

/// <summary>Result of the data-chain check over all stages.</summary>
/// <param name="Stages">One result per stage, in chain order.</param>
/// <param name="CenterGps">Candidate time, GPS seconds.</param>
/// <param name="WindowSeconds">On-source half window, seconds.</param>
/// <param name="SigmaThreshold">Threshold in robust sigma.</param>
/// <param name="Verdict">"something added" when any stage says so, otherwise "nothing added".</param>
/// <param name="Assumptions">Model, discretisation, delay method and statistics used, in words.</param>
public sealed record DataChainReport(IReadOnlyList<ChainStageResult> Stages, double CenterGps, double WindowSeconds, double SigmaThreshold, string Verdict, IReadOnlyList<string> Assumptions);
