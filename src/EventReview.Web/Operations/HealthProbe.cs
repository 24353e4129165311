using EventReview.Core.Time;
using EventReview.Data;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Operations;

/// <summary>
/// The checks behind <c>GET /healthz</c>: the database answers, no migration is pending, the attachment folder
/// takes a write and has free space, and the bundled leap-second table has not expired.
/// </summary>
public sealed class HealthProbe(IDbContextFactory<AppDbContext> dbFactory, DatabaseSettings settings, IOptions<OperationsOptions> options, TimeProvider clock,
    EventReview.Data.Records.RecordKeeping? records = null)
{
    public async Task<HealthReport> RunAsync(CancellationToken ct)
    {
        var lines = new List<HealthCheckLine>();
        await using var db = await dbFactory.CreateDbContextAsync(ct);
        var reachable = await DatabaseAsync(db, lines, ct);
        if (reachable)
        {
            await MigrationsAsync(db, lines, ct);
        }
        else
        {
            lines.Add(new HealthCheckLine("migrations", false, "Not checked: the database did not answer."));
        }

        lines.Add(Attachments());
        lines.Add(LeapSeconds());
        lines.AddRange(RecordLines(records, settings.DataDirectory));
        var report = new HealthReport("ok", lines);
        return report.Healthy ? report : report with { Status = "failing" };
    }

    private async Task<bool> DatabaseAsync(AppDbContext db, List<HealthCheckLine> lines, CancellationToken ct)
    {
        try
        {
            var ok = await db.Database.CanConnectAsync(ct);
            lines.Add(new HealthCheckLine("database", ok, ok ? $"{settings.Provider} database answers." : $"{settings.Provider} database does not answer."));
            return ok;
        }
        catch (Exception ex) when (ex is not OperationCanceledException)
        {
            lines.Add(new HealthCheckLine("database", false, $"{settings.Provider} database does not answer ({ex.GetType().Name})."));
            return false;
        }
    }

    private static async Task MigrationsAsync(AppDbContext db, List<HealthCheckLine> lines, CancellationToken ct)
    {
        try
        {
            var pending = (await db.Database.GetPendingMigrationsAsync(ct)).ToList();
            lines.Add(pending.Count == 0
                ? new HealthCheckLine("migrations", true, $"Schema current ({db.Database.GetMigrations().Count()} migrations applied).")
                : new HealthCheckLine("migrations", false, $"{pending.Count} migration(s) pending: {string.Join(", ", pending.Select(MigrationName))}. Restart the app to apply them."));
        }
        catch (Exception ex) when (ex is not OperationCanceledException)
        {
            lines.Add(new HealthCheckLine("migrations", false, $"Could not read the migration history ({ex.GetType().Name})."));
        }
    }

    /// <summary>
    /// The record key (must be able to sign) and the witness (its last append must have worked; a warning while it sits
    /// inside the data folder, where whoever can change the database can change it too).
    /// </summary>
    public static IEnumerable<HealthCheckLine> RecordLines(EventReview.Data.Records.RecordKeeping? records, string dataDirectory)
    {
        if (records is null)
        {
            yield return new HealthCheckLine("record-key", false, "No record key is configured: new entries are not signed.");
            yield break;
        }

        var current = records.Keys.Current;
        yield return current is null
            ? new HealthCheckLine("record-key", false, "No record key can sign: see the key folder (EventReview:Records:KeyDirectory).")
            : new HealthCheckLine("record-key", true, $"Record key {Core.Records.RecordKeyFingerprint.Short(current.KeyId)} signs.");
        var w = records.Witness;
        var sender = w.Sender is { } s ? s.LastError is null ? $" Also sent to {s.Endpoint.Host}." : $" Sending to {s.Endpoint.Host} fails ({s.LastError}); {s.Waiting} line(s) waiting." : string.Empty;
        if (w.LastError is { } error)
        {
            yield return new HealthCheckLine("witness", false, $"The last append to the witness failed ({error.Split(':')[0]}); see the Integrity page.{sender}");
        }
        else if (records.Settings.WitnessInside(dataDirectory))
        {
            yield return new HealthCheckLine("witness", true, "Warning: the witness is inside the data folder, where whoever can change the database can change it too. "
                + $"Move it to another machine's mount (EventReview:Records:WitnessDirectory).{sender}", Warning: true);
        }
        else
        {
            yield return new HealthCheckLine("witness", true, "Witness outside the data folder" + (w.LastAppend is { } at ? $", last written {at.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC." : ".") + sender);
        }
    }

    private static string MigrationName(string id) => id.Contains('_') ? id[(id.IndexOf('_') + 1)..] : id;

    private HealthCheckLine Attachments()
    {
        var folder = settings.AttachmentDirectory;
        try
        {
            Directory.CreateDirectory(folder);
            var probe = Path.Combine(folder, $".healthz-{Guid.NewGuid():N}");
            File.WriteAllBytes(probe, [1]);
            File.Delete(probe);
            var free = new DriveInfo(Path.GetFullPath(folder)).AvailableFreeSpace;
            var minimum = options.Value.MinimumFreeBytes;
            return free >= minimum
                ? new HealthCheckLine("attachments", true, $"Attachment folder writable; {Gigabytes(free)} free (minimum {Gigabytes(minimum)}).")
                : new HealthCheckLine("attachments", false, $"Attachment folder writable but only {Gigabytes(free)} free (minimum {Gigabytes(minimum)}): uploads will soon fail.");
        }
        catch (Exception ex) when (ex is IOException or UnauthorizedAccessException or ArgumentException)
        {
            return new HealthCheckLine("attachments", false, $"Attachment folder is not writable ({ex.GetType().Name}).");
        }
    }

    private HealthCheckLine LeapSeconds()
    {
        var table = LeapSecondTable.Bundled;
        var now = clock.GetUtcNow().UtcDateTime;
        return table.IsStale(now)
            ? new HealthCheckLine("leap-seconds", false, $"Bundled leap-second table expired on {table.ExpiresUtc:yyyy-MM-dd}: GPS/UTC conversions after that date may miss a leap second. Update the application.")
            : new HealthCheckLine("leap-seconds", true, $"Leap-second table valid until {table.ExpiresUtc:yyyy-MM-dd}.");
    }

    private static string Gigabytes(long bytes) => $"{bytes / 1e9:0.0} GB";
}
