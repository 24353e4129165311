namespace EventReview.Data.Backup;

/// <summary>A backup or restore that was refused or failed; the message names the file, entry or attachment concerned.</summary>
public sealed class BackupException : Exception
{
    public BackupException(string message)
        : base(message)
    {
    }

    public BackupException(string message, Exception inner)
        : base(message, inner)
    {
    }
}
