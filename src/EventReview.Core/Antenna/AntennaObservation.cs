namespace EventReview.Core.Antenna;

/// <summary>
/// What the waveform-overlap check (or a reviewer) found for a pair of sites: the relative sign of site b's
/// waveform with respect to site a's (+1 same sign, -1 flipped) and the amplitude ratio |h_b| / |h_a| (&gt; 0).
/// </summary>
public sealed record AntennaObservation(int Sign, double AmplitudeRatio);
