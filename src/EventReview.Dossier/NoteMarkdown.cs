using Ganss.Xss;
using Markdig;

namespace EventReview.Dossier;

/// <summary>
/// The one Markdown pipeline for everything a person writes (notes, case summaries, checklist guidance), used alike by
/// the app's pages and the dossier's <c>index.html</c>, so a note reads the same in both: CommonMark with pipe tables
/// and emphasis extras; raw HTML in the text is shown as text, never passed through; the result is sanitised again
/// (no scripts, no event handlers, no <c>javascript:</c> links). Deterministic for a given text.
/// </summary>
public static class NoteMarkdown
{
    private static readonly MarkdownPipeline Pipeline = new MarkdownPipelineBuilder().UsePipeTables().UseEmphasisExtras().DisableHtml().Build();

    // The sanitiser is configured once and only read afterwards, so one instance serves every thread.
    private static readonly HtmlSanitizer Sanitizer = new();

    /// <summary>Sanitised HTML for <paramref name="markdown"/>; empty for null or blank text.</summary>
    public static string ToHtml(string? markdown) =>
        string.IsNullOrWhiteSpace(markdown) ? string.Empty : Sanitizer.Sanitize(Markdown.ToHtml(markdown, Pipeline));
}
