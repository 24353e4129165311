using EventReview.Core.Cases;
using EventReview.Data;
using EventReview.Data.Notifications;
using EventReview.Data.Writes;
using Microsoft.EntityFrameworkCore;

namespace EventReview.Web.Notifications;

/// <summary>After a verification in the app: tells the coordinators when it found problems (<see cref="VerifyFailureNotices"/>).</summary>
public sealed class VerifyFailureReporter(IWriteGate writes, TimeProvider clock, ILogger<VerifyFailureReporter> log)
{
    /// <summary>Records the notifications; a failure to record is logged and never hides the verification's own result.</summary>
    public async Task ReportAsync(string source, IReadOnlyList<IntegrityProblem> problems, CancellationToken ct = default)
    {
        if (problems.Count == 0)
        {
            return;
        }

        try
        {
            await writes.RunAsync(async (db, token) =>
            {
                await VerifyFailureNotices.AddAsync(db, source, problems, clock.GetUtcNow(), token);
                return await db.SaveChangesAsync(token);
            }, ct);
        }
        catch (DbUpdateException ex)
        {
            log.LogError(ex, "Could not record the verification failure for the coordinators' notifications");
        }
    }
}
