namespace EventReview.Core.Inputs;

/// <summary>
/// The stated ranges of the numbers and the longest texts that the app stores. Every entity checks its own values
/// against these before it changes (see <see cref="InputGuard"/>), so a value outside them is refused wherever it comes
/// from (API, pages, command line, import) and can never be stored to break a later read.
/// </summary>
public static class InputLimits
{
    /// <summary>Largest per-site SNR accepted (dimensionless). Real candidates have SNRs of order 10-100; 10^4 leaves room for any search while keeping the network SNR (root sum of squares) finite.</summary>
    public const double MaxSnr = 1e4;

    /// <summary>Longest candidate id, characters.</summary>
    public const int MaxCandidateIdLength = 128;

    /// <summary>Longest attachment description, characters.</summary>
    public const int MaxDescriptionLength = 2_000;

    /// <summary>Longest link title, characters.</summary>
    public const int MaxLinkTitleLength = 500;

    /// <summary>Longest link URL, characters.</summary>
    public const int MaxUrlLength = 2_048;

    /// <summary>Longest content type of an attachment, characters (RFC 6838 names are at most 127 + 1 + 127).</summary>
    public const int MaxContentTypeLength = 255;

    /// <summary>Longest sign-off statement, closing statement or reason, characters.</summary>
    public const int MaxStatementLength = 4_000;

    /// <summary>Longest printed name of a person or a site, characters.</summary>
    public const int MaxNameLength = 120;

    /// <summary>Largest attachment size recorded, bytes (1 TiB; the server's own upload limit is far lower).</summary>
    public const long MaxSizeBytes = 1L << 40;
}
