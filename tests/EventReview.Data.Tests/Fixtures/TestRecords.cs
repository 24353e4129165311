using EventReview.Data.Records;

namespace EventReview.Data.Tests.Fixtures;

/// <summary>The record key and witness of a test data folder (<c>keys/</c> and <c>witness/</c> inside it), with a signing key.</summary>
public static class TestRecords
{
    public static RecordKeeping For(string dataFolder)
    {
        var records = RecordKeeping.Open(RecordSettings.ForDataDirectory(dataFolder));
        ((FileRecordKeyRing)records.Keys).EnsureSigningKey(DateTimeOffset.UtcNow, recordIsSigned: false);
        return records;
    }

    /// <summary>A factory over <paramref name="settings"/> that signs and witnesses with the records of its data folder.</summary>
    public static AppDbContextFactory Factory(DatabaseSettings settings) => new(settings, For(settings.DataDirectory));
}
