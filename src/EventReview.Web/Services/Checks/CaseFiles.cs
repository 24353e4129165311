using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Core.Evidence.Roles;
using EventReview.Data;

namespace EventReview.Web.Services.Checks;

/// <summary>Files attached anywhere in a case, for checks that take files as input (strain, triggers, segments, models).</summary>
public sealed class CaseFiles(AttachmentStore store)
{
    /// <summary>One attached file: which item it is on, its name, size, hash and role (null when none was recorded).</summary>
    public sealed record CaseFile(string ItemKey, string FileName, long SizeBytes, string Sha256, DateTimeOffset AddedAt, FileRole? Role = null)
    {
        public string Label => $"{FileName} ({ItemKey}, {(SizeBytes < 10 * 1024 ? $"{SizeBytes:N0} bytes" : $"{SizeBytes / 1024.0:N0} KB")}, {AddedAt.UtcDateTime:yyyy-MM-dd HH:mm} UTC)";

        /// <summary>The role in plain words, or "role not recorded".</summary>
        public string RoleTitle => Role?.Title ?? "role not recorded";
    }

    /// <summary>Every attachment of the case, newest first, distinct by hash (the newest row's role).</summary>
    public static IReadOnlyList<CaseFile> List(ReviewCase c) => c.Items
        .SelectMany(i => i.Evidence.Where(e => e.Kind == EvidenceKind.Attachment)
            .Select(e => new CaseFile(i.Key, e.FileName ?? e.ContentSha256, e.SizeBytes ?? 0, e.ContentSha256, e.AddedAt, e.FileRole)))
        .OrderByDescending(f => f.AddedAt)
        .DistinctBy(f => f.Sha256)
        .ToList();

    /// <summary>
    /// The files a picker for <paramref name="kind"/> lists, newest first: those whose role serves it (the named site's
    /// first, then those of no stated site), then files stored before roles existed. Files with another role are left out.
    /// </summary>
    public static IReadOnlyList<CaseFile> ForRole(IReadOnlyList<CaseFile> files, FileRoleKind kind, string? site = null) =>
    [
        .. files.Where(f => f.Role is { } r && r.Kind == kind && site is not null && string.Equals(r.Site, site, StringComparison.OrdinalIgnoreCase)),
        .. files.Where(f => f.Role is { } r && r.Kind == kind && (site is null || r.Site is null)),
        .. files.Where(f => f.Role is null),
    ];

    /// <summary>The file to preselect for <paramref name="kind"/> (and <paramref name="site"/>): the newest whose role serves it; null when none does.</summary>
    public static string? Preferred(IReadOnlyList<CaseFile> files, FileRoleKind kind, string? site = null) =>
        ForRole(files, kind, site).FirstOrDefault(f => f.Role is not null)?.Sha256;

    /// <summary>The bytes of an attachment, checked against its hash.</summary>
    /// <exception cref="IOException">When the file is missing or altered on disk.</exception>
    public async Task<byte[]> ReadAsync(string sha256, CancellationToken ct = default)
    {
        await using var s = store.Open(sha256) ?? throw new IOException($"The stored file {sha256[..12]} is missing from the attachment store.");
        using var ms = new MemoryStream();
        await s.CopyToAsync(ms, ct);
        var bytes = ms.ToArray();
        if (Hashing.Sha256Hex(bytes) != sha256)
        {
            throw new IOException($"The stored file {sha256[..12]} no longer matches its SHA-256; it was altered on disk.");
        }

        return bytes;
    }

    /// <summary>The text of an attachment (UTF-8).</summary>
    public async Task<string> ReadTextAsync(string sha256, CancellationToken ct = default) =>
        System.Text.Encoding.UTF8.GetString(await ReadAsync(sha256, ct));
}
