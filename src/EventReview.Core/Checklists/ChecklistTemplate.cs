namespace EventReview.Core.Checklists;

/// <summary>A review checklist as written in a <c>checklists/*.yaml</c> file.</summary>
public sealed class ChecklistTemplate
{
    /// <summary>Template name, the file name without extension ("candidate-review").</summary>
    public string Name { get; set; } = string.Empty;

    /// <summary>Title of the checklist, for people.</summary>
    public string Title { get; set; } = string.Empty;

    /// <summary>What the checklist is for, in a sentence or two.</summary>
    public string Description { get; set; } = string.Empty;

    /// <summary>Integer version of the template, recorded on each case made from it.</summary>
    public int Version { get; set; } = 1;

    /// <summary>The sections in order, each with its items.</summary>
    public List<TemplateSection> Sections { get; set; } = [];

    /// <summary>All items in section order.</summary>
    public IEnumerable<(TemplateSection Section, TemplateItem Item)> Items() =>
        Sections.SelectMany(s => s.Items.Select(i => (s, i)));
}
