using System.Collections.Concurrent;
using EventReview.Core.Inputs;
using EventReview.Data.Telemetry;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Long-running checks run here, off the request and the render thread. A job is keyed by case, item and kind, so a
/// page that is reloaded finds its job again; progress is a fraction and a sentence ("slide 3,200 of 10,000, 41,000
/// coincidences"); a job can be cancelled. Finished jobs are kept (with their outcome message) until replaced.
/// </summary>
public sealed class CheckJobs(ILogger<CheckJobs> logger, TimeProvider clock)
{
    private readonly ConcurrentDictionary<string, CheckJob> _jobs = new(StringComparer.Ordinal);

    /// <summary>The key of a check job.</summary>
    public static string Key(int caseId, string itemKey, string kind) => $"{caseId}/{itemKey}/{kind}";

    /// <summary>The job under <paramref name="key"/>, if any.</summary>
    public CheckJob? Get(string key) => _jobs.TryGetValue(key, out var job) ? job : null;

    /// <summary>Starts a job unless one is already running under the key (then returns that one).</summary>
    public CheckJob Start(string key, string description, Func<CheckJob, CancellationToken, Task<string>> work)
    {
        var job = new CheckJob(key, description, clock);
        var existing = _jobs.AddOrUpdate(key, job, (_, old) => old.IsRunning ? old : job);
        if (!ReferenceEquals(existing, job))
        {
            return existing;
        }

        var kind = KindOf(key);
        ReviewMetrics.JobStarted(kind);
        _ = Task.Run(async () =>
        {
            try
            {
                var message = await work(job, job.Cancellation.Token);
                job.Finish(message, null);
                ReviewMetrics.JobFinished(kind);
            }
            catch (OperationCanceledException)
            {
                job.Finish(null, "Cancelled; nothing was stored.");
                ReviewMetrics.JobFailed(kind, "cancelled");
            }
            catch (Exception ex) when (ex is ArgumentException or FormatException or InvalidOperationException or KeyNotFoundException or UnauthorizedAccessException or IOException)
            {
                job.Finish(null, UserMessage.From(ex));
                ReviewMetrics.JobFailed(kind, "refused");
            }
            catch (Exception ex)
            {
                logger.LogError(ex, "Check job {Key} failed", key);
                ReviewMetrics.JobFailed(kind, "error");
                job.Finish(null, "The check failed unexpectedly; nothing was stored. The error was logged for the administrator.");
            }
        });
        return job;
    }

    /// <summary>The kind part of a key made by <see cref="Key"/> (its last segment).</summary>
    public static string KindOf(string key) => key[(key.LastIndexOf('/') + 1)..];
}
