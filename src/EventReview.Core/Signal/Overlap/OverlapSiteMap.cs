using EventReview.Core.Signal.TimeFrequency;

namespace EventReview.Core.Signal.Overlap;

/// <summary>
/// The time-frequency map of one site (Q transform of whitened strain, same settings at every site) summarised, with its chirp fit.
/// The map itself is stored as SVG pictures (whole span and zoom); here are its extent and loudest tile. Records of format 1 held a
/// short-time Fourier map: their <see cref="ResolutionHz"/> and <see cref="SegmentSeconds"/> are set and the Q fields are null.
/// </summary>
/// <param name="Site">Site code.</param>
/// <param name="FileName">Strain file used.</param>
/// <param name="Fit">Chirp-track fit (null when the map could not be made).</param>
/// <param name="Error">Why the map could not be made (null when it was).</param>
/// <param name="FromSeconds">First column, seconds from the candidate time.</param>
/// <param name="ToSeconds">Last column, seconds from the candidate time.</param>
/// <param name="LowHz">Lowest frequency of the map, Hz.</param>
/// <param name="HighHz">Highest frequency of the map, Hz.</param>
/// <param name="ResolutionHz">Format 1 only: STFT frequency resolution, Hz (0 for a Q map).</param>
/// <param name="SegmentSeconds">Format 1 only: STFT segment length, seconds (0 for a Q map).</param>
/// <param name="PeakEnergy">Largest value of the map (power / median for a Q map).</param>
/// <param name="PeakSeconds">Time of the loudest cell, seconds from the candidate time.</param>
/// <param name="PeakHz">Frequency of the loudest cell, Hz.</param>
/// <param name="PeakQ">Q of the loudest tile (format 2).</param>
/// <param name="QMin">Smallest Q plane used (format 2).</param>
/// <param name="QMax">Largest Q plane used (format 2).</param>
/// <param name="MaxMismatch">The tiling's largest mismatch (format 2).</param>
/// <param name="ColourCap">Top of the picture's colour scale: the map's 99.5th percentile of power / median (format 2).</param>
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
    double PeakHz,
    double? PeakQ = null,
    double? QMin = null,
    double? QMax = null,
    double? MaxMismatch = null,
    double? ColourCap = null);
