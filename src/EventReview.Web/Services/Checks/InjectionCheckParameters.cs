namespace EventReview.Web.Services.Checks;

/// <summary>Parameters of the injection-log lookup: the attached log (by SHA-256) and the margin on both sides of each injection.</summary>
public sealed record InjectionCheckParameters(string? LogSha, double MarginSeconds = 10.0)
{
    /// <exception cref="ArgumentException">When the margin is out of range.</exception>
    public void Validate()
    {
        if (!double.IsFinite(MarginSeconds) || MarginSeconds < 0 || MarginSeconds > 86400)
        {
            throw new ArgumentException("Margin must be between 0 and 86400 s.", nameof(MarginSeconds));
        }
    }
}
