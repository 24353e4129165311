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
    public bool IsHdf5 => !string.IsNullOrWhiteSpace(Hdf5Dataset);
}
