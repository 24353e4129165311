using System.Text.Json;
using System.Text.Json.Serialization;

namespace EventReview.Data.Backup;

/// <summary>
/// Layout of an EventReview backup archive (a ZIP): <c>manifest.json</c>, <c>database/eventreview.db</c> (SQLite only)
/// and <c>attachments/ab/abcdef...</c> in the same relative layout as the attachment store.
/// </summary>
public static class BackupFormat
{
    /// <summary>Format name and version written to and required in every manifest.</summary>
    public const string Name = "eventreview-backup/1";

    /// <summary>Entry name of the manifest.</summary>
    public const string ManifestPath = "manifest.json";

    /// <summary>Entry name of the SQLite database copy.</summary>
    public const string DatabasePath = "database/" + DatabaseSettings.SqliteFileName;

    /// <summary>Folder prefix of attachment entries.</summary>
    public const string AttachmentPrefix = "attachments/";

    /// <summary>camelCase JSON, indented, enums as strings.</summary>
    public static JsonSerializerOptions Json { get; } = new(JsonSerializerDefaults.Web)
    {
        WriteIndented = true,
        Converters = { new JsonStringEnumConverter() },
    };

    /// <summary>Entry name of an attachment by its SHA-256 (lowercase hex).</summary>
    public static string AttachmentEntry(string sha256) => $"{AttachmentPrefix}{sha256[..2]}/{sha256}";

    /// <summary>
    /// The SHA-256 named by an attachment entry (<c>attachments/ab/ab...</c>), or null when the name does not follow
    /// the store layout.
    /// </summary>
    public static string? ShaOfAttachmentEntry(string entryName)
    {
        if (!entryName.StartsWith(AttachmentPrefix, StringComparison.Ordinal))
        {
            return null;
        }

        var parts = entryName[AttachmentPrefix.Length..].Split('/');
        return parts.Length == 2 && IsStoreName(parts[0], parts[1]) ? parts[1] : null;
    }

    /// <summary>True when <paramref name="folder"/>/<paramref name="file"/> is a content-addressed store path (lowercase hex).</summary>
    public static bool IsStoreName(string folder, string file) =>
        folder.Length == 2 && Core.Evidence.Hashing.IsSha256Hex(file)
        && file.StartsWith(folder, StringComparison.Ordinal);
}
