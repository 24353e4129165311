using EventReview.Core.Time;
using EventReview.Data;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Operations;

/// <summary>
/// The checks behind <c>GET /healthz</c>: the database answers, no migration is pending, the attachment folder
/// takes a write and has free space, and the bundled leap-second table has not expired.
/// </summary>
public sealed class HealthProbe(IDbContextFactory<AppDbContext> dbFactory, DatabaseSettings settings, IOptions<OperationsOptions> options, TimeProvider clock)
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
