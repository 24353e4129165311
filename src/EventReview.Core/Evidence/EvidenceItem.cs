using EventReview.Core.Evidence.Roles;
using EventReview.Core.Inputs;

namespace EventReview.Core.Evidence;

/// <summary>
/// One piece of evidence on a checklist item: a note, an attachment or a link. Evidence is append-only:
/// it is never edited; a correction is a new piece. The content hash feeds the item's evidence fingerprint.
/// </summary>
public sealed class EvidenceItem
{
    private EvidenceItem()
    {
        Text = string.Empty;
        AddedBy = string.Empty;
        AddedByName = string.Empty;
        ContentSha256 = string.Empty;
    }

    private EvidenceItem(EvidenceKind kind, string text, string contentSha256, string? fileName, string? contentType, long? sizeBytes, string? url, Cases.Actor by, DateTimeOffset at,
        string? role = null)
    {
        Role = role;
        Kind = kind;
        Text = text;
        ContentSha256 = contentSha256;
        FileName = fileName;
        ContentType = contentType;
        SizeBytes = sizeBytes;
        Url = url;
        AddedBy = by.UserId;
        AddedByName = by.DisplayName;
        AddedAt = Time.RecordedTime.Normalize(at);
    }

    /// <summary>Database key of the evidence.</summary>
    public int Id { get; private set; }

    /// <summary>Database key of the checklist item the evidence belongs to.</summary>
    public int ChecklistItemId { get; private set; }

    /// <summary>Whether this is a note, an attachment or a link.</summary>
    public EvidenceKind Kind { get; private set; }

    /// <summary>Note text (Markdown), link title, or attachment description.</summary>
    public string Text { get; private set; }

    /// <summary>Lowercase hex SHA-256 of the content: the note's UTF-8 text, the file's bytes, or the link's URL.</summary>
    public string ContentSha256 { get; private set; }

    /// <summary>Original file name as uploaded (display only; the file is stored by hash, never by this name).</summary>
    public string? FileName { get; private set; }

    /// <summary>Content (MIME) type of an attachment as uploaded; null for notes and links.</summary>
    public string? ContentType { get; private set; }

    /// <summary>Size of an attachment, bytes; null for notes and links.</summary>
    public long? SizeBytes { get; private set; }

    /// <summary>Absolute http or https URL of a link; null for notes and attachments.</summary>
    public string? Url { get; private set; }

    /// <summary>
    /// An attachment's role as stored (<see cref="FileRole.Word"/>: "strain:KP", "dq-segments"), given or confirmed at upload;
    /// null for notes, links and attachments stored before roles existed. Sealed with the row (seal version 2).
    /// </summary>
    public string? Role { get; private set; }

    /// <summary>The role read from <see cref="Role"/>, or null when none was stored.</summary>
    public FileRole? FileRole => Roles.FileRole.TryParse(Role);

    /// <summary>User id of whoever added the evidence.</summary>
    public string AddedBy { get; private set; }

    /// <summary>Printed name of whoever added the evidence, as it was then.</summary>
    public string AddedByName { get; private set; }

    /// <summary>When it was added, UTC, to whole milliseconds (<see cref="Time.RecordedTime"/>).</summary>
    public DateTimeOffset AddedAt { get; private set; }

    /// <summary>
    /// SHA-256 over this row's canonical content (version 1: kind, content hash, file name, size, URL, who added it and
    /// the UTC ticks of when; version 2, for a row with a <see cref="Role"/>: the same fields followed by the role),
    /// recorded in the case timeline when the evidence is added, so that a later edit of the row is caught by
    /// verification. Rows without a role keep version 1, so rows stored before roles existed still verify.
    /// </summary>
    public string Seal() => ComputeSeal(Kind.ToString(), ContentSha256, FileName, SizeBytes, Url, AddedBy, AddedByName, AddedAt.UtcTicks, Role);

    /// <summary>
    /// The seal (see <see cref="Seal"/>) from plain values; <paramref name="kind"/> is the member name ("Note", "Attachment", "Link"),
    /// <paramref name="role"/> the stored role word (null: version 1, without it).
    /// </summary>
    public static string ComputeSeal(string kind, string contentSha256, string? fileName, long? sizeBytes, string? url, string addedBy, string addedByName, long addedUtcTicks,
        string? role = null)
    {
        string[] fields = [kind, contentSha256, fileName ?? string.Empty,
            sizeBytes?.ToString(System.Globalization.CultureInfo.InvariantCulture) ?? string.Empty, url ?? string.Empty, addedBy, addedByName,
            addedUtcTicks.ToString(System.Globalization.CultureInfo.InvariantCulture)];
        return role is null
            ? Hashing.Sha256Hex(string.Join('\n', ["eventreview-evidence-row-v1", .. fields]))
            : Hashing.Sha256Hex(string.Join('\n', ["eventreview-evidence-row-v2", .. fields, role]));
    }

    /// <summary>
    /// SHA-256 over what the seal does not cover (version 1: the text, i.e. a link's title or a file's description, and
    /// the content type), recorded next to the seal in the timeline entry's facts.
    /// </summary>
    public string DetailSha256() => ComputeDetailSha256(Text, ContentType);

    /// <summary>The detail hash (see <see cref="DetailSha256"/>) from plain values.</summary>
    public static string ComputeDetailSha256(string text, string? contentType) =>
        Hashing.Sha256Hex(string.Join('\n', "eventreview-evidence-detail-v1", text, contentType ?? string.Empty));

    /// <summary>True when a note's stored hash matches its text (other kinds: always true here; files are checked on disk).</summary>
    public bool NoteHashMatches() => Kind != EvidenceKind.Note || ContentSha256 == Hashing.Sha256Hex(Text);

    /// <summary>A Markdown note. Empty notes and notes over 100,000 characters are refused.</summary>
    public static EvidenceItem Note(string markdown, Cases.Actor by, DateTimeOffset at)
    {
        if (string.IsNullOrWhiteSpace(markdown))
        {
            throw new ArgumentException("text: the note is empty.", "text");
        }

        if (markdown.Length > 100_000)
        {
            throw new ArgumentException("text: the note is longer than 100,000 characters; attach it as a file instead.", "text");
        }

        return new EvidenceItem(EvidenceKind.Note, markdown, Hashing.Sha256Hex(markdown), null, null, null, null, by, at);
    }

    /// <summary>
    /// An attachment already stored under its SHA-256; <paramref name="fileName"/> is kept for display only, <paramref name="role"/>
    /// says which check input it is (null: none recorded).
    /// </summary>
    /// <exception cref="ArgumentException">When the hash, size, content type or description is invalid (see <see cref="CheckAttachmentFields"/>).</exception>
    public static EvidenceItem Attachment(string fileName, string contentType, long sizeBytes, string sha256, string description, Cases.Actor by, DateTimeOffset at,
        FileRole? role = null)
    {
        if (!Hashing.IsSha256Hex(sha256))
        {
            throw new ArgumentException("The attachment hash must be 64 lowercase hex digits.", nameof(sha256));
        }

        if (sizeBytes < 0 || sizeBytes > InputLimits.MaxSizeBytes)
        {
            throw new ArgumentOutOfRangeException(nameof(sizeBytes), sizeBytes, $"sizeBytes must be from 0 to {InputLimits.MaxSizeBytes} bytes.");
        }

        CheckAttachmentFields(contentType, description);
        var safeName = SafeFileName.From(fileName);

        return new EvidenceItem(EvidenceKind.Attachment, description ?? string.Empty, sha256, safeName, contentType, sizeBytes, null, by, at, role?.Word);
    }

    /// <summary>
    /// The checks of an attachment's own fields, run before its bytes are stored so that a refused upload leaves nothing
    /// behind: a description of at most <see cref="InputLimits.MaxDescriptionLength"/> characters and a content type of
    /// at most <see cref="InputLimits.MaxContentTypeLength"/> characters without hidden characters.
    /// </summary>
    /// <exception cref="ArgumentException">Naming <c>description</c> or <c>contentType</c>.</exception>
    public static void CheckAttachmentFields(string? contentType, string? description)
    {
        InputGuard.Text(description, InputLimits.MaxDescriptionLength, "description");
        InputGuard.Identifier(contentType, InputLimits.MaxContentTypeLength, "contentType");
    }

    /// <summary>A link; only absolute http(s) URLs of at most <see cref="InputLimits.MaxUrlLength"/> characters are accepted.</summary>
    /// <exception cref="ArgumentException">When the URL or the title is invalid or too long.</exception>
    public static EvidenceItem Link(string url, string title, Cases.Actor by, DateTimeOffset at)
    {
        InputGuard.Text(url, InputLimits.MaxUrlLength, nameof(url));
        if (!Uri.TryCreate(url, UriKind.Absolute, out var uri) || (uri.Scheme != Uri.UriSchemeHttp && uri.Scheme != Uri.UriSchemeHttps))
        {
            throw new ArgumentException("The link must be an absolute http or https URL.", nameof(url));
        }

        InputGuard.Text(title?.Trim(), InputLimits.MaxLinkTitleLength, nameof(title));
        return new EvidenceItem(EvidenceKind.Link, string.IsNullOrWhiteSpace(title) ? uri.ToString() : title.Trim(), Hashing.Sha256Hex(uri.ToString()), null, null, null, uri.ToString(), by, at);
    }
}
