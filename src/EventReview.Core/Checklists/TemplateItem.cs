namespace EventReview.Core.Checklists;

/// <summary>One item of a checklist template.</summary>
public sealed class TemplateItem
{
    /// <summary>Stable key, unique in the template: lower-case letters, digits, dots and dashes.</summary>
    public string Key { get; set; } = string.Empty;

    /// <summary>Title of the item, as the checklist shows it.</summary>
    public string Title { get; set; } = string.Empty;

    /// <summary>Guidance for whoever works the item, in Markdown.</summary>
    public string Guidance { get; set; } = string.Empty;

    /// <summary>Optional computed check kind (<see cref="CheckKind"/>).</summary>
    public string? Check { get; set; }

    /// <summary>Distinct sign-offs needed (1-5, default 1).</summary>
    public int Signoffs { get; set; } = 1;

    /// <summary>Whether the item's owner may be one of the signers (default false: four-eyes).</summary>
    public bool OwnerMaySign { get; set; }

    /// <summary>Days after case creation the item is due (optional).</summary>
    public int? DueDays { get; set; }
}
