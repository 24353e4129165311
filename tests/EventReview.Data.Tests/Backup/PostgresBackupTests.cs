using System.IO.Compression;
using EventReview.Core.Evidence;
using EventReview.Data.Backup;
using EventReview.Data.Tests.Fixtures;
using Npgsql;

namespace EventReview.Data.Tests.Backup;

/// <summary>
/// The documented PostgreSQL procedure end to end: <c>pg_dump -Fc</c>, then <c>eventreview backup</c> of the
/// attachments; <c>pg_restore</c> into an empty database, then <c>eventreview restore</c> of the attachments with that
/// database, which verifies the whole record.
/// </summary>
[Collection(PostgresCollection.Name)]
public sealed class PostgresBackupTests(PostgresServer server) : IDisposable
{
    private readonly TempFolder _root = new("er-pg-backup");

    public void Dispose() => _root.Dispose();

    [Fact]
    public async Task Dump_plus_attachment_backup_restores_into_an_empty_database_and_verifies()
    {
        var source = new DatabaseSettings(DatabaseProvider.Postgres, await server.DatabaseAsync("BackupSource"), Path.Combine(_root.Path, "data"));
        var factory = TestRecords.Factory(source);
        await DatabaseInitializer.MigrateAsync(factory);
        await new AttachmentStore(source).SaveAsync(new MemoryStream("abc"u8.ToArray()), 1024);
        await using (var db = factory.CreateDbContext())
        {
            db.Cases.Add(SignedCase());
            await db.SaveChangesAsync();
        }

        var (sourceCases, _) = await new IntegrityVerifier(factory, new AttachmentStore(source), source, factory.Records).VerifyAsync();
        Assert.True(sourceCases.All(c => c.Valid), "SOURCE: " + string.Join("; ", sourceCases.SelectMany(c => c.Problems).Select(p => p.What)));
        var dump = Path.Combine(_root.Path, "db.dump");
        var archive = Path.Combine(_root.Path, "files.zip");
        await ProcessRunner.RunAsync("pg_dump", ["-Fc", "--no-owner", "-d", Libpq(source.ConnectionString), "-f", dump], TimeSpan.FromMinutes(2));
        var backup = await BackupWriter.CreateAsync(source, archive);

        Assert.Equal((DatabaseProvider.Postgres, 1, 1), (backup.Provider, backup.CaseCount, backup.AttachmentCount));
        Assert.Contains("pg_dump -Fc", backup.Note, StringComparison.Ordinal);
        using (var zip = ZipFile.OpenRead(archive))
        {
            var sha = Hashing.Sha256Hex("abc");
            Assert.Equal([$"attachments/{sha[..2]}/{sha}", "manifest.json"], zip.Entries.Select(e => e.FullName));
        }

        var restoredDb = await server.DatabaseAsync("BackupTarget");
        await ProcessRunner.RunAsync("pg_restore", ["--no-owner", "-d", Libpq(restoredDb), dump], TimeSpan.FromMinutes(2));
        var folder = Path.Combine(_root.Path, "restored");

        var refused = await Assert.ThrowsAsync<BackupException>(() => BackupRestorer.RestoreAsync(archive, DatabaseSettings.ForSqlite(folder)));
        var report = await BackupRestorer.RestoreAsync(archive, new DatabaseSettings(DatabaseProvider.Postgres, restoredDb, folder),
            new RestoreOptions(Records: Data.Records.RecordSettings.ForDataDirectory(source.DataDirectory)));

        Assert.Contains("restore the database with pg_restore first", refused.Message, StringComparison.Ordinal);
        Assert.True(report.Valid, string.Join("; ", report.Problems.Select(p => p.What)));
        Assert.Equal((1, 1), (report.CaseCount, report.AttachmentCount));
        Assert.True(new AttachmentStore(DatabaseSettings.ForSqlite(folder)).Verify(Hashing.Sha256Hex("abc")));
    }

    /// <summary>
    /// A case with an attachment and a sign-off, at whole-microsecond times: PostgreSQL keeps timestamps to 1 µs, and a
    /// sign-off signed at a time with finer ticks does not verify there even before any backup (seen while writing this
    /// test; reported, not fixed here).
    /// </summary>
    private static Core.Cases.ReviewCase SignedCase()
    {
        var t = new DateTimeOffset(2026, 3, 1, 12, 0, 0, TimeSpan.Zero).AddTicks(1_234_560);
        var c = SampleCases.Open("TC-PG-BACKUP", t);
        var (a, b) = (SampleCases.ReviewerA, SampleCases.ReviewerB);
        c.AssignItem("alpha.one", a.UserId, a.DisplayName, SampleCases.Coordinator, t.AddSeconds(1));
        c.StartItem("alpha.one", a, t.AddSeconds(2));
        c.AddEvidence("alpha.one", EvidenceItem.Attachment("plot.png", "image/png", 3, Hashing.Sha256Hex("abc"), "A plot", a, t.AddSeconds(3)), a, t.AddSeconds(3));
        c.AddEvidence("alpha.one", EvidenceItem.Note("A note.", a, t.AddSeconds(4)), a, t.AddSeconds(4));
        c.MarkItemReady("alpha.one", a, t.AddSeconds(5));
        var at = t.AddSeconds(6);
        c.SignItem("alpha.one", b, SignOffMeaning.Reviewed, "Looked at both.", c.Item("alpha.one").Fingerprint(), at, Core.Time.GpsUtc.FromUtc(at.UtcDateTime));
        return c;
    }

    /// <summary>The libpq keyword form of an Npgsql connection string, for the command-line tools.</summary>
    private static string Libpq(string npgsql)
    {
        var b = new NpgsqlConnectionStringBuilder(npgsql);
        return $"host={b.Host} port={b.Port} user={b.Username} dbname={b.Database}";
    }
}
