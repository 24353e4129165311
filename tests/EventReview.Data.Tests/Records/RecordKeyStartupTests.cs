using EventReview.Data.Records;
using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests.Records;

public sealed class RecordKeyStartupTests : IDisposable
{
    private readonly TempFolder _folder = new("er-key-start");

    public void Dispose()
    {
        Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
        _folder.Dispose();
    }

    [Fact]
    public async Task A_new_installation_gets_a_key_but_a_signed_database_without_its_key_refuses_to_start()
    {
        var settings = DatabaseSettings.ForSqlite(_folder.Path);
        using (var records = RecordKeeping.Open(RecordSettings.ForDataDirectory(_folder.Path)))
        {
            var factory = new AppDbContextFactory(settings, records);
            await DatabaseInitializer.MigrateAsync(factory);
            await RecordKeyStartup.EnsureSigningKeyAsync(factory, TimeProvider.System);
            Assert.NotNull(records.Keys.Current);
            await using var db = factory.CreateDbContext();
            db.Cases.Add(SampleCases.Open("TC-START-1"));
            await db.SaveChangesAsync();
        }

        // The key folder is lost (or the app is pointed at another one): no new key is made over a signed record.
        var elsewhere = RecordSettings.From(Path.Combine(_folder.Path, "other-keys"), null, null, _folder.Path);
        using var lost = RecordKeeping.Open(elsewhere);
        var ex = await Assert.ThrowsAsync<InvalidOperationException>(() => RecordKeyStartup.EnsureSigningKeyAsync(new AppDbContextFactory(settings, lost), TimeProvider.System));

        Assert.Contains("already signed", ex.Message, StringComparison.Ordinal);
        Assert.Null(lost.Keys.Current);
    }
}
