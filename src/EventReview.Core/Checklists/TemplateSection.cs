namespace EventReview.Core.Checklists;

/// <summary>A group of checklist items (one point of the review).</summary>
public sealed class TemplateSection
{
    public string Key { get; set; } = string.Empty;

    public string Title { get; set; } = string.Empty;

    public List<TemplateItem> Items { get; set; } = [];
}
