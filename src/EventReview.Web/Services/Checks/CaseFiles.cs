using EventReview.Core.Cases;
using EventReview.Core.Evidence;
using EventReview.Data;

namespace EventReview.Web.Services.Checks;

/// <summary>Files attached anywhere in a case, for checks that take files as input (strain, triggers, segments, models).</summary>
public sealed class CaseFiles(AttachmentStore store)
{
    /// <summary>One attached file: which item it is on, its name, size and hash.</summary>
    public sealed record CaseFile(string ItemKey, string FileName, long SizeBytes, string Sha256, DateTimeOffset AddedAt)
    {
        public string Label => $"{FileName} ({ItemKey}, {(SizeBytes < 10 * 1024 ? $"{SizeBytes:N0} bytes" : $"{SizeBytes / 1024.0:N0} KB")})";
    }

    /// <summary>Every attachment of the case, newest first, distinct by hash.</summary>
    public static IReadOnlyList<CaseFile> List(ReviewCase c) => c.Items
        .SelectMany(i => i.Evidence.Where(e => e.Kind == EvidenceKind.Attachment)
            .Select(e => new CaseFile(i.Key, e.FileName ?? e.ContentSha256, e.SizeBytes ?? 0, e.ContentSha256, e.AddedAt)))
        .OrderByDescending(f => f.AddedAt)
        .DistinctBy(f => f.Sha256)
        .ToList();

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
