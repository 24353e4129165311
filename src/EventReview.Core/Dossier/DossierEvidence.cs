namespace EventReview.Core.Dossier;

/// <summary>
/// A note, attachment or link. <paramref name="Kind"/> is "note", "attachment" or "link";
/// <paramref name="ContentSha256"/> hashes the note's UTF-8 text, the file's bytes or the link's URL.
/// For an attachment, <paramref name="AttachmentPath"/> is where its bytes are in the ZIP (<c>attachments/For an attachment, <paramref name="AttachmentPath"/> is where its bytes are in the ZIP (<c>attachments/&lt;sha256&gt;</c>).lt;sha256 prefixFor an attachment, <paramref name="AttachmentPath"/> is where its bytes are in the ZIP (<c>attachments/&lt;sha256&gt;</c>).gt;-For an attachment, <paramref name="AttachmentPath"/> is where its bytes are in the ZIP (<c>attachments/&lt;sha256&gt;</c>).lt;safe nameFor an attachment, <paramref name="AttachmentPath"/> is where its bytes are in the ZIP (<c>attachments/&lt;sha256&gt;</c>).gt;.For an attachment, <paramref name="AttachmentPath"/> is where its bytes are in the ZIP (<c>attachments/&lt;sha256&gt;</c>).lt;extFor an attachment, <paramref name="AttachmentPath"/> is where its bytes are in the ZIP (<c>attachments/&lt;sha256&gt;</c>).gt;</c>, see <see cref="AttachmentNames"/>; the hash alone before schema 3).
/// <paramref name="Role"/> is an attachment's stored role word ("strain:KP"), null when none was recorded (and in dossiers made before roles).
/// </summary>
public sealed record DossierEvidence(
    long Id,
    string Kind,
    string Text,
    string? FileName,
    string? ContentType,
    long? SizeBytes,
    string? Url,
    string ContentSha256,
    string? AttachmentPath,
    string AddedBy,
    string AddedByName,
    string AddedAtUtc,
    long AddedAtUtcTicks,
    string? Role = null);
