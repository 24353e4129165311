namespace EventReview.Web.Services.Live;

/// <summary>Someone else with the case open: their name, the item they have open (or null) and what they are doing there (or null).</summary>
public sealed record PresentPerson(string DisplayName, string? ItemKey, string? Doing)
{
    /// <summary>"Ben Example (editing a note)", "Ben Example" when only viewing.</summary>
    public string Label => Doing is null ? DisplayName : $"{DisplayName} ({Doing})";
}
