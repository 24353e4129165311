namespace EventReview.Web.Services;

/// <summary>
/// Markdown to sanitised HTML for the pages: the same pipeline as the dossier (<see cref="EventReview.Dossier.NoteMarkdown"/>),
/// so a note reads the same in the app and in the exported <c>index.html</c>.
/// </summary>
public sealed class MarkdownRenderer
{
    /// <summary>Sanitised HTML for <paramref name="markdown"/>; empty for null or blank text.</summary>
    public string ToHtml(string? markdown) => EventReview.Dossier.NoteMarkdown.ToHtml(markdown);
}
