namespace EventReview.Data;

/// <summary>An upload exceeded the configured size limit.</summary>
public sealed class AttachmentTooLargeException(long limitBytes)
    : Exception($"The file is larger than the limit of {limitBytes / (1024 * 1024)} MB.")
{
    public long LimitBytes { get; } = limitBytes;
}
