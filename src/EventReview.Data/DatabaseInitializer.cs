using Microsoft.EntityFrameworkCore;

namespace EventReview.Data;

/// <summary>Creates the data folder, applies migrations, sets SQLite's WAL journal mode and starts the notification cursor.</summary>
public static class DatabaseInitializer
{
    public static async Task MigrateAsync(AppDbContextFactory factory, CancellationToken ct = default)
    {
        Directory.CreateDirectory(factory.Settings.DataDirectory);
        Directory.CreateDirectory(factory.Settings.AttachmentDirectory);
        await using var db = factory.CreateDbContext();
        await db.Database.MigrateAsync(ct);
        if (factory.Settings.Provider == DatabaseProvider.Sqlite)
        {
            await db.Database.ExecuteSqlRawAsync("PRAGMA journal_mode=WAL;", ct);
        }

        await StartNotificationCursorAsync(db, ct);
    }

    /// <summary>
    /// The notification worker reads the timeline from its cursor on: the first time, the cursor is put at the current
    /// end of the timeline, so that nothing from before notifications existed is told and nothing after is missed.
    /// </summary>
    private static async Task StartNotificationCursorAsync(AppDbContext db, CancellationToken ct)
    {
        if (await db.NotificationCursors.AnyAsync(c => c.Name == Notifications.NotificationCursor.Timeline, ct))
        {
            return;
        }

        var end = await db.Timeline.MaxAsync(a => (long?)a.Id, ct) ?? 0;
        db.NotificationCursors.Add(Notifications.NotificationCursor.Start(Notifications.NotificationCursor.Timeline, end));
        try
        {
            await db.SaveChangesAsync(ct);
        }
        catch (DbUpdateException)
        {
            // Another instance started it at the same moment.
        }
    }
}
