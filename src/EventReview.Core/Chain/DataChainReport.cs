using EventReview.Core.Verdicts;

namespace EventReview.Core.Chain;

/// <summary>Result of the data-chain check over all stages (record format 2).</summary>
/// <param name="Stages">One result per stage, in chain order.</param>
/// <param name="CenterGps">Candidate time, GPS seconds.</param>
/// <param name="WindowSeconds">On-source half window, seconds.</param>
/// <param name="FalseAlarmProbability">Stated probability of a noise-only crossing per stage over its on-source samples.</param>
/// <param name="Judgement">"excess found" when a stage whose model fits shows an on-source excess; otherwise "model does not fit"
/// when a stage's model does not fit; otherwise "residual is noise".</param>
/// <param name="Assumptions">Model, discretisation, delay method and statistics used, in words.</param>
public sealed record DataChainReport(IReadOnlyList<ChainStageResult> Stages, double CenterGps, double WindowSeconds, double FalseAlarmProbability,
    Judgement Judgement, IReadOnlyList<string> Assumptions);
