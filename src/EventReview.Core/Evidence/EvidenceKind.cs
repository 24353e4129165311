namespace EventReview.Core.Evidence;

/// <summary>What a piece of evidence is.</summary>
public enum EvidenceKind
{
    /// <summary>A Markdown note.</summary>
    Note,

    /// <summary>A file stored content-addressed by SHA-256.</summary>
    Attachment,

    /// <summary>A link to an outside resource (logbook entry, plot page).</summary>
    Link,
}
