using EventReview.Core.Time;
using EventReview.Data;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace EventReview.Web.Operations;

/// <summary>
/// The parts behind <c>GET /healthz/ready</c>, each run as one of the framework's health checks
/// (<see cref="ReadinessCheck"/>): the database answers, no migration is pending, the attachment folder takes a write and
/// has free space, the bundled leap-second table has not expired, the record key signs and the witness takes appends.
/// A part that passes with a warning (disk space getting low, leap-second table near expiry, witness inside the data
/// folder) makes the server "degraded": still ready, still live.
/// </summary>
public sealed class HealthProbe(IDbContextFactory<AppDbContext> dbFactory, DatabaseSettings settings, IOptions<OperationsOptions> options, TimeProvider clock,
    EventReview.Data.Records.RecordKeeping? records = null)
{
    /// <summary>The parts, in the order the readiness body lists them.</summary>
    public static readonly string[] Parts = ["database", "migrations", "attachments", "leap-seconds", "record-key", "witness"];

    /// <summary>Days before the leap-second table expires from which readiness warns (common practice: a release cycle or two).</summary>
    public const int LeapSecondWarningDays = 90;

    /// <summary>Checks one part (one of <see cref="Parts"/>).</summary>
    public async Task<HealthCheckLine> CheckAsync(string part, CancellationToken ct)
    {
        switch (part)
        {
            case "database":
            case "migrations":
                var lines = new List<HealthCheckLine>();
                await using (var db = await dbFactory.CreateDbContextAsync(ct))
                {
                    var reachable = await DatabaseAsync(db, lines, ct);
                    if (part == "database")
                    {
                        return lines[0];
                    }

                    if (!reachable)
                    {
                        return new HealthCheckLine("migrations", false, "Not checked: the database did not answer.");
                    }

                    await MigrationsAsync(db, lines, ct);
                    return lines[^1];
                }

            case "attachments":
                return Attachments();
            case "leap-seconds":
                return LeapSeconds();
            case "record-key":
                return RecordLines(records, settings.DataDirectory).First();
            case "witness":
                return RecordLines(records, settings.DataDirectory).Skip(1).FirstOrDefault() ?? new HealthCheckLine("witness", false, "No witness: no record key is configured.");
            default:
                throw new ArgumentOutOfRangeException(nameof(part), part, "not a health part");
        }
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
            var low = options.Value.LowFreeBytes;
            if (free < minimum)
            {
                return new HealthCheckLine("attachments", false, $"Attachment folder writable but only {Gigabytes(free)} free (minimum {Gigabytes(minimum)}): uploads will soon fail.");
            }

            return free < low
                ? new HealthCheckLine("attachments", true, $"Warning: disk space low: {Gigabytes(free)} free (warning below {Gigabytes(low)}, failing below {Gigabytes(minimum)}).", Warning: true)
                : new HealthCheckLine("attachments", true, $"Attachment folder writable; {Gigabytes(free)} free (minimum {Gigabytes(minimum)}).");
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
        if (table.IsStale(now))
        {
            return new HealthCheckLine("leap-seconds", false, $"Bundled leap-second table expired on {table.ExpiresUtc:yyyy-MM-dd}: GPS/UTC conversions after that date may miss a leap second. Update the application.");
        }

        var left = table.ExpiresUtc.DayNumber - DateOnly.FromDateTime(now).DayNumber;
        return left <= LeapSecondWarningDays
            ? new HealthCheckLine("leap-seconds", true, $"Warning: the bundled leap-second table expires on {table.ExpiresUtc:yyyy-MM-dd} ({left} days): update the application before then.", Warning: true)
            : new HealthCheckLine("leap-seconds", true, $"Leap-second table valid until {table.ExpiresUtc:yyyy-MM-dd}.");
    }

    private static string Gigabytes(long bytes) => $"{bytes / 1e9:0.0} GB";
}
