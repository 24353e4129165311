namespace EventReview.Web.Services.Checks;

/// <summary>
/// Parameters of the data-chain check as run from a case: the attached recorded input of the first stage, the recorded
/// output of each stage in order, the stage-model JSON (all by SHA-256), the on-source half window and the false-alarm
/// probability the per-sample threshold is set from (over the on-source samples). The centre is the case time.
/// </summary>
public sealed record ChainCheckParameters(string? InputSha, IReadOnlyList<string> OutputShas, string? ModelSha, double WindowSeconds = 1.0, double FalseAlarmProbability = 1e-3)
{
    /// <exception cref="ArgumentException">When a pick is missing or a value is out of range.</exception>
    public void Validate()
    {
        if (OutputShas is null || OutputShas.Count == 0 || OutputShas.Any(string.IsNullOrWhiteSpace))
        {
            throw new ArgumentException("Pick the recorded output of every stage, in order.", nameof(OutputShas));
        }

        if (!double.IsFinite(WindowSeconds) || WindowSeconds <= 0 || WindowSeconds > 3600)
        {
            throw new ArgumentException("Window must be > 0 and at most 3600 s.", nameof(WindowSeconds));
        }

        if (!(FalseAlarmProbability is >= 1e-12 and <= 0.5))
        {
            throw new ArgumentException("False-alarm probability must be between 1e-12 and 0.5.", nameof(FalseAlarmProbability));
        }
    }
}
