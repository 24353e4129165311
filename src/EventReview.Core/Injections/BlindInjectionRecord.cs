using System.Text;
using EventReview.Core.Time;

namespace EventReview.Core.Injections;

/// <summary>
/// The canonical content of a sealed blind-injection record: UTF-8 CSV with the injection log's header
/// <c>site,start_gps,end_gps,kind,waveform_ref,status</c> and one row per blind injection (a record with a header and
/// no rows means "no blind injection"). The file is hashed byte for byte, so whoever seals it keeps the exact bytes.
/// </summary>
public static class BlindInjectionRecord
{
    /// <summary>Parses the record bytes (UTF-8, optional BOM) into injection rows.</summary>
    /// <exception cref="Imports.CsvFormatException">Naming the line of a bad row.</exception>
    public static IReadOnlyList<InjectionRecord> Parse(byte[] record, IReadOnlyCollection<string>? knownSites)
    {
        ArgumentNullException.ThrowIfNull(record);
        using var reader = new StreamReader(new MemoryStream(record), Encoding.UTF8, detectEncodingFromByteOrderMarks: true);
        return InjectionLogCsv.Parse(reader, knownSites);
    }

    /// <summary>
    /// Verifies the commitment and, only when it matches, parses the record and looks up blind injections overlapping
    /// the candidate. Returns null when the commitment does not match (nothing is revealed).
    /// </summary>
    public static InjectionOverlapReport? Open(string commitment, byte[] record, string saltHex, GpsTime caseTime,
        IReadOnlyDictionary<string, GpsTime> arrivals, IEnumerable<string> sites, double marginSeconds)
    {
        if (!SealedRecord.Verify(commitment, record, saltHex))
        {
            return null;
        }

        return InjectionOverlap.Find(Parse(record, null), caseTime, arrivals, sites, marginSeconds);
    }
}
