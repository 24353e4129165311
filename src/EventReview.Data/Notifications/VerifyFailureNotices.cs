using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Notifications;
using EventReview.Data.Writes;
using Microsoft.Extensions.DependencyInjection;

namespace EventReview.Data.Notifications;

/// <summary>
/// Tells every coordinator when a verification (the Integrity page, a case's "Verify", <c>eventreview verify</c>) found
/// problems. The same problems found again on the same UTC day are told once.
/// </summary>
public static class VerifyFailureNotices
{
    /// <summary>
    /// Records the notifications through the write gate of <paramref name="services"/> (the command-line tool; the web
    /// app's worker sends them). Nothing when there are no problems.
    /// </summary>
    public static async Task RecordAsync(IServiceProvider services, string source, IReadOnlyList<IntegrityProblem> problems, CancellationToken ct = default)
    {
        if (problems.Count == 0)
        {
            return;
        }

        var now = (services.GetService<TimeProvider>() ?? TimeProvider.System).GetUtcNow();
        await services.GetRequiredService<IWriteGate>().RunAsync(async (db, token) =>
        {
            await AddAsync(db, source, problems, now, token);
            return await db.SaveChangesAsync(token);
        }, ct);
    }

    /// <summary>Adds the notifications to <paramref name="db"/> (the caller saves); nothing when there are no problems.</summary>
    /// <param name="source">Where the verification ran, e.g. "the Integrity page" or "eventreview verify".</param>
    public static async Task<int> AddAsync(AppDbContext db, string source, IReadOnlyList<IntegrityProblem> problems, DateTimeOffset now, CancellationToken ct = default)
    {
        if (problems.Count == 0)
        {
            return 0;
        }

        var first = problems[0];
        var fingerprint = Hashing.Sha256Hex(string.Join('\n', problems.Select(p => $"{p.Case}|{p.Entry}|{p.Item}|{p.What}")))[..16];
        var subject = $"Verification found {problems.Count} problem(s) in the record";
        var text = $"A verification run from {source} at {now.UtcDateTime:yyyy-MM-dd HH:mm} UTC found {problems.Count} problem(s). " +
            $"First: {first.Case}{(first.Entry is null ? string.Empty : $" entry {first.Entry}")}{(first.Item is null ? string.Empty : $" item {first.Item}")}: {first.What} " +
            "Open the Integrity page to see them all, and do not rely on the affected records until they are explained.";
        var day = now.UtcDateTime.ToString("yyyy-MM-dd", System.Globalization.CultureInfo.InvariantCulture);
        var notices = (await NotificationInbox.CoordinatorIdsAsync(db, ct))
            .Select(id => Notification.Create(id, NotificationKind.VerifyFailed, null, null, subject, text, "/integrity", $"{NotificationKind.VerifyFailed}:{id}:{day}:{fingerprint}", now));
        return await NotificationInbox.AddNewAsync(db, notices, ct);
    }
}
