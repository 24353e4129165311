namespace EventReview.Core.Chain;

/// <summary>An excursion of the residual outside the on-source window: listed for people, never part of the candidate's verdict.</summary>
/// <param name="Gps">Time of its largest sample, GPS seconds.</param>
/// <param name="OffsetSeconds">That time minus the candidate time, seconds.</param>
/// <param name="Sigma">Its largest |residual - off-source median| in robust sigma.</param>
/// <param name="Samples">Samples above the outside threshold in it (neighbours closer than 10 ms are one excursion).</param>
public sealed record ChainExcursion(double Gps, double OffsetSeconds, double Sigma, int Samples);
