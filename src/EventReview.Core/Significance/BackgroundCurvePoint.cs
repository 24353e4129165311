namespace EventReview.Core.Significance;

/// <summary>One point of the cumulative background: how often noise alone reaches a ranking statistic.</summary>
/// <param name="Statistic">Ranking statistic threshold.</param>
/// <param name="Count">Background coincidences with statistic &gt;= the threshold (&gt;= 1).</param>
/// <param name="RateHz">Count / background time, in Hz.</param>
public sealed record BackgroundCurvePoint(double Statistic, long Count, double RateHz);
