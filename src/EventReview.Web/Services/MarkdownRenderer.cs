using Ganss.Xss;
using Markdig;

namespace EventReview.Web.Services;

/// <summary>Markdown to sanitised HTML (no scripts, no event handlers, no raw HTML surprises).</summary>
public sealed class MarkdownRenderer
{
    private readonly MarkdownPipeline _pipeline = new MarkdownPipelineBuilder().UseAdvancedExtensions().Build();
    private readonly HtmlSanitizer _sanitizer = new();

    public string ToHtml(string? markdown) =>
        string.IsNullOrWhiteSpace(markdown) ? string.Empty : _sanitizer.Sanitize(Markdown.ToHtml(markdown, _pipeline));
}
