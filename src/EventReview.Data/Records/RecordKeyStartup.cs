using Microsoft.EntityFrameworkCore;

namespace EventReview.Data.Records;

/// <summary>Start-up step of every writer (the app, the command line): make sure the record key can sign.</summary>
public static class RecordKeyStartup
{
    /// <summary>
    /// Creates the first record key when the key folder holds none and nothing in the database is signed yet; refuses
    /// with a message naming the folder when the database is signed but its key is missing (see
    /// <see cref="FileRecordKeyRing.EnsureSigningKey"/>). Does nothing for a key ring that is not a key folder.
    /// </summary>
    /// <exception cref="InvalidOperationException">When no key can sign.</exception>
    public static async Task EnsureSigningKeyAsync(AppDbContextFactory factory, TimeProvider clock, CancellationToken ct = default)
    {
        if (factory.Records?.Keys is not FileRecordKeyRing ring || ring.Current is not null)
        {
            return;
        }

        await using var db = factory.CreateDbContext();
        var signed = await db.Timeline.AnyAsync(a => a.KeyId != null, ct) || await db.AccountEvents.AnyAsync(e => e.KeyId != null, ct);
        ring.EnsureSigningKey(Core.Time.RecordedTime.Normalize(clock.GetUtcNow()), signed);
    }
}
