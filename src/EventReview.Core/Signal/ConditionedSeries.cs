using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Signal;

/// <summary>A whitened, band-passed series with the PSD used and the index range unaffected by tapers and transients.</summary>
/// <param name="Data">Whitened, band-passed samples (dimensionless; unit variance per unit bandwidth fraction for Gaussian noise).</param>
/// <param name="Psd">The Welch PSD of the raw data used for whitening.</param>
/// <param name="ValidStart">First trustworthy sample index.</param>
/// <param name="ValidEnd">One past the last trustworthy sample index.</param>
public sealed record ConditionedSeries(TimeSeries Data, Psd Psd, int ValidStart, int ValidEnd);
