namespace EventReview.Web.Services.Checks;

/// <summary>One running or finished check (see <see cref="CheckJobs"/>). Thread-safe for progress reads.</summary>
public sealed class CheckJob(string key, string description, TimeProvider clock)
{
    private readonly Lock _gate = new();

    public string Key { get; } = key;

    public string Description { get; } = description;

    public DateTimeOffset StartedAt { get; } = clock.GetUtcNow();

    public CancellationTokenSource Cancellation { get; } = new();

    public bool IsRunning { get; private set; } = true;

    /// <summary>0..1, or null when unknown.</summary>
    public double? Fraction { get; private set; }

    public string Progress { get; private set; } = "starting";

    /// <summary>Set when finished successfully (what was stored).</summary>
    public string? Result { get; private set; }

    /// <summary>Set when finished with an error or cancelled.</summary>
    public string? Error { get; private set; }

    /// <summary>When the job ended (null while running).</summary>
    public DateTimeOffset? FinishedAt { get; private set; }

    /// <summary>Running time so far, or the total once finished.</summary>
    public TimeSpan Elapsed => (FinishedAt ?? clock.GetUtcNow()) - StartedAt;

    public void Report(double? fraction, string progress)
    {
        lock (_gate)
        {
            Fraction = fraction;
            Progress = progress;
        }
    }

    public void Cancel() => Cancellation.Cancel();

    internal void Finish(string? result, string? error)
    {
        lock (_gate)
        {
            Result = result;
            Error = error;
            FinishedAt = clock.GetUtcNow();
            IsRunning = false;
        }
    }
}
