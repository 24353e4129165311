using EventReview.Data.Records;

namespace EventReview.Cli.Tests;

/// <summary>The record key and witness of a test data folder (<c>keys/</c> and <c>witness/</c> inside it, as the CLI finds them by default), with a signing key.</summary>
internal static class CliRecords
{
    public static RecordKeeping For(string dataFolder)
    {
        var records = RecordKeeping.Open(RecordSettings.ForDataDirectory(dataFolder));
        ((FileRecordKeyRing)records.Keys).EnsureSigningKey(DateTimeOffset.UtcNow, recordIsSigned: false);
        return records;
    }
}
