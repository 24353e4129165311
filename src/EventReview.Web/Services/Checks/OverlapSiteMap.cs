using EventReview.Core.Signal.TimeFrequency;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// The time-frequency map of one site (short-time Fourier transform of whitened strain, same settings at every site) summarised,
/// with its chirp fit. The map itself is stored as the SVG picture; here are its extent and loudest cell.
/// </summary>
/// <param name="Site">Site code.</param>
/// <param name="FileName">Strain file used.</param>
/// <param name="Fit">Chirp-track fit (null when the map could not be made).</param>
/// <param name="Error">Why the map could not be made (null when it was).</param>
/// <param name="FromSeconds">First segment centre, seconds from the candidate time.</param>
/// <param name="ToSeconds">Last segment centre, seconds from the candidate time.</param>
/// <param name="LowHz">Lowest frequency of the map, Hz.</param>
/// <param name="HighHz">Highest frequency of the map, Hz.</param>
/// <param name="ResolutionHz">Frequency resolution (1 / segment length), Hz.</param>
/// <param name="SegmentSeconds">Segment length, seconds.</param>
/// <param name="PeakEnergy">Largest normalised energy (noise mean 1).</param>
/// <param name="PeakSeconds">Time of the loudest cell, seconds from the candidate time.</param>
/// <param name="PeakHz">Frequency of the loudest cell, Hz.</param>
public sealed record OverlapSiteMap(
    string Site,
    string FileName,
    ChirpFit? Fit,
    string? Error,
    double FromSeconds,
    double ToSeconds,
    double LowHz,
    double HighHz,
    double ResolutionHz,
    double SegmentSeconds,
    double PeakEnergy,
    double PeakSeconds,
    double PeakHz);
