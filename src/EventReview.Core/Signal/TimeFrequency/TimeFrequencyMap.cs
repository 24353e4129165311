namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>
/// A time-frequency energy map. Energy[i][j] belongs to TimesSeconds[i] (segment centre, seconds relative to the
/// reference GPS time) and FrequenciesHz[j]. Energies are |X|² / Σw² of whitened data, so Gaussian noise has mean 1.
/// </summary>
/// <param name="ReferenceGps">GPS time that TimesSeconds are measured from (decimal seconds).</param>
/// <param name="TimesSeconds">Segment centres, seconds after the reference.</param>
/// <param name="FrequenciesHz">Frequencies of the rows, Hz.</param>
/// <param name="Energy">Normalised energy per time (outer) and frequency (inner).</param>
/// <param name="ResolutionHz">Frequency resolution 1 / segment length, Hz.</param>
public sealed record TimeFrequencyMap(string ReferenceGps, double[] TimesSeconds, double[] FrequenciesHz, double[][] Energy, double ResolutionHz);
