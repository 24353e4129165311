using EventReview.Core.Time;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// One strain file chosen from the case's attachments. Text files ("gps_time value" per line) need nothing else; for an
/// HDF5 file name the dataset and, when the file has no timing attributes, the start GPS time and the sample rate.
/// </summary>
/// <param name="Sha256">Hash of the attachment.</param>
/// <param name="Hdf5Dataset">Dataset path inside an HDF5 file (e.g. "/strain"); null or empty for a text file.</param>
/// <param name="StartGps">GPS time of the first HDF5 sample given by hand (decimal seconds); null to read the attribute.</param>
/// <param name="SampleRateHz">HDF5 sample rate given by hand (Hz); null to read the attribute.</param>
public sealed record StrainPick(string Sha256, string? Hdf5Dataset = null, decimal? StartGps = null, double? SampleRateHz = null)
{
    /// <summary>Whether the file is read as HDF5 (a dataset is named).</summary>
    public bool IsHdf5 => !string.IsNullOrWhiteSpace(Hdf5Dataset);

    /// <summary>
    /// Reads the run form's fields of one site's strain file: the chosen file, and for an HDF5 file the dataset path, the
    /// start (GPS seconds, blank to read the attribute, parsed by <see cref="GpsTime.TryParse"/> to the nanosecond) and the
    /// sample rate. On failure <paramref name="problem"/> names the field and the site.
    /// </summary>
    /// <param name="label">The site's label on the form ("A" or "B").</param>
    /// <param name="sha256">The chosen attachment, or null when none is chosen.</param>
    /// <param name="isHdf5">Whether the chosen file is HDF5 (by its name).</param>
    /// <param name="dataset">HDF5 dataset path as typed.</param>
    /// <param name="startGps">HDF5 start as typed (GPS seconds), blank to read the attribute.</param>
    /// <param name="sampleRateHz">HDF5 sample rate (Hz), null to read the attribute.</param>
    /// <param name="pick">The pick, or null on failure.</param>
    /// <param name="problem">What was wrong, or null.</param>
    public static bool TryParse(string label, string? sha256, bool isHdf5, string? dataset, string? startGps, double? sampleRateHz, out StrainPick? pick, out string? problem)
    {
        pick = null;
        problem = null;
        if (sha256 is null)
        {
            problem = $"Strain of site {label}: pick the strain file of site {label}.";
            return false;
        }

        if (!isHdf5)
        {
            pick = new StrainPick(sha256);
            return true;
        }

        if (string.IsNullOrWhiteSpace(dataset))
        {
            problem = $"HDF5 dataset of {label}: the file is HDF5, so give the dataset path (e.g. /strain).";
            return false;
        }

        decimal? start = null;
        if (!string.IsNullOrWhiteSpace(startGps))
        {
            if (!GpsTime.TryParse(startGps, out var t))
            {
                problem = $"Start GPS (s) of {label}: \"{startGps.Trim()}\" is not a GPS time in seconds (e.g. 1400000000.25).";
                return false;
            }

            start = t.Nanoseconds / (decimal)GpsTime.NanosecondsPerSecond;
        }

        pick = new StrainPick(sha256, dataset.Trim(), start, sampleRateHz);
        return true;
    }
}
