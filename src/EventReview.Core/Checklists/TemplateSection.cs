namespace EventReview.Core.Checklists;

/// <summary>A group of checklist items (one point of the review).</summary>
public sealed class TemplateSection
{
    /// <summary>Key of the section, recorded on each item made from it.</summary>
    public string Key { get; set; } = string.Empty;

    /// <summary>Title of the section, as the checklist shows it.</summary>
    public string Title { get; set; } = string.Empty;

    /// <summary>The section's items in order.</summary>
    public List<TemplateItem> Items { get; set; } = [];
}
