namespace EventReview.Core.Signal.Io;

/// <summary>A strain file could not be read; <see cref="LineNumber"/> names the offending line (1-based, 0 when the whole file is at fault).</summary>
public sealed class StrainFormatException : FormatException
{
    /// <summary>Creates the exception; the message is prefixed with "line N: " when N &gt; 0.</summary>
    public StrainFormatException(int lineNumber, string message)
        : base(lineNumber > 0 ? $"line {lineNumber}: {message}" : message)
    {
        LineNumber = lineNumber;
    }

    /// <summary>1-based line number of the problem, or 0 for a file-level problem (e.g. too few samples).</summary>
    public int LineNumber { get; }
}
