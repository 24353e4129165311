namespace EventReview.Web.Services;

/// <summary>Settings under the configuration section <c>EventReview</c>.</summary>
public sealed class EventReviewOptions
{
    public const string Section = "EventReview";

    /// <summary>Data folder: SQLite file and attachments (env <c>EventReview__DataDirectory</c>; default ./data).</summary>
    public string DataDirectory { get; set; } = "./data";

    /// <summary>Largest accepted upload in bytes (default 200 MB).</summary>
    public long MaxUploadBytes { get; set; } = 200L * 1024 * 1024;

    /// <summary>Seed the invented demo network, cases and accounts into an empty database (Development only by default).</summary>
    public bool? SeedDemo { get; set; }

    /// <summary>Folder of checklist templates (*.yaml); default: the copy next to the app, else ./checklists.</summary>
    public string? ChecklistDirectory { get; set; }
}
