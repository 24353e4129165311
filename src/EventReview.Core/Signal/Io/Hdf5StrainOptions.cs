using EventReview.Core.Time;

namespace EventReview.Core.Signal.Io;

/// <summary>Where to find strain and its timing in an HDF5 file.</summary>
/// <param name="DatasetPath">Path of the one-dimensional numeric dataset holding the samples, e.g. "/site/strain".</param>
/// <param name="Start">GPS time of the first sample given by hand; null to read <paramref name="StartAttribute"/>.</param>
/// <param name="SampleRateHz">Sample rate given by hand, Hz; null to read <paramref name="RateAttribute"/> (or 1 / <paramref name="StepAttribute"/>).</param>
/// <param name="StartAttribute">Dataset attribute with the start GPS seconds (default "start_gps").</param>
/// <param name="RateAttribute">Dataset attribute with the sample rate in Hz (default "sample_rate_hz").</param>
/// <param name="StepAttribute">Dataset attribute with the sample spacing in seconds, used when the rate attribute is absent (default "dt").</param>
public sealed record Hdf5StrainOptions(
    string DatasetPath,
    GpsTime? Start = null,
    double? SampleRateHz = null,
    string StartAttribute = "start_gps",
    string RateAttribute = "sample_rate_hz",
    string StepAttribute = "dt");
