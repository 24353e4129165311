using System.IO.Compression;
using EventReview.Core.Dossier;

namespace EventReview.Dossier;

/// <summary>
/// Reads a dossier ZIP safely and verifies it with <see cref="DossierVerifier"/> (against the trusted record keys) and
/// <see cref="DossierRenderingCheck"/> (the readable files re-rendered from <c>dossier.json</c>). Entries whose names hold "..", start
/// with '/' or a drive letter, or use backslashes are refused (and not read); so are archives with more than
/// <see cref="MaxEntries"/> entries or more than <see cref="MaxTotalBytes"/> bytes uncompressed. A truncated or corrupt
/// ZIP gives a problem, not an exception.
/// </summary>
public static class DossierArchive
{
    /// <summary>Largest number of entries read.</summary>
    public const int MaxEntries = 10_000;

    /// <summary>Largest total uncompressed size read, bytes (2 GiB).</summary>
    public const long MaxTotalBytes = 2L * 1024 * 1024 * 1024;

    /// <summary>Name used for problems about the ZIP as a whole.</summary>
    public const string ZipName = "(zip)";

    /// <summary>Reads and verifies the ZIP in <paramref name="zip"/>; only a signature by one of <paramref name="trustedKeys"/> makes it valid.</summary>
    public static async Task<DossierVerification> VerifyAsync(Stream zip, IReadOnlyList<Core.Records.RecordPublicKey>? trustedKeys = null, CancellationToken ct = default)
    {
        ArgumentNullException.ThrowIfNull(zip);
        var problems = new List<DossierProblem>();
        var files = await ReadAsync(zip, problems, ct);
        if (files is null)
        {
            return DossierVerification.Of(problems);
        }

        var result = DossierVerifier.Verify(files, trustedKeys);
        problems.AddRange(result.Problems);
        if (DossierVerifier.Read(files, []) is { } doc)
        {
            DossierRenderingCheck.Check(doc, files, problems);
        }

        return DossierVerification.Of(problems, result.SignedBy, result.Signature);
    }

    /// <summary>
    /// Reads every safe entry into memory (path to bytes); problems found on the way are added to
    /// <paramref name="problems"/>. Returns null when the archive cannot be read at all.
    /// </summary>
    public static async Task<Dictionary<string, byte[]>?> ReadAsync(Stream zip, List<DossierProblem> problems, CancellationToken ct = default)
    {
        Stream seekable = zip;
        if (!zip.CanSeek)
        {
            var copy = new MemoryStream();
            await zip.CopyToAsync(copy, ct);
            copy.Position = 0;
            seekable = copy;
        }

        ZipArchive archive;
        try
        {
            archive = new ZipArchive(seekable, ZipArchiveMode.Read, leaveOpen: true);
        }
        catch (InvalidDataException ex)
        {
            problems.Add(new DossierProblem(ZipName, null, "not a readable ZIP file (truncated or corrupt): " + ex.Message));
            return null;
        }

        using (archive)
        {
            if (archive.Entries.Count > MaxEntries)
            {
                problems.Add(new DossierProblem(ZipName, null, $"has {archive.Entries.Count} entries; at most {MaxEntries} are read."));
                return null;
            }

            var total = archive.Entries.Sum(e => e.Length);
            if (total > MaxTotalBytes || total < 0)
            {
                problems.Add(new DossierProblem(ZipName, null, $"expands to {total} bytes; at most {MaxTotalBytes} are read."));
                return null;
            }

            var files = new Dictionary<string, byte[]>(StringComparer.Ordinal);
            foreach (var entry in archive.Entries)
            {
                var name = entry.FullName;
                if (!IsSafe(name))
                {
                    problems.Add(new DossierProblem(name, null, "unsafe entry name (\"..\", absolute path or backslash); not read."));
                    continue;
                }

                if (name.EndsWith('/') && entry.Length == 0)
                {
                    continue;
                }

                if (files.ContainsKey(name))
                {
                    problems.Add(new DossierProblem(name, null, "appears twice in the ZIP."));
                    continue;
                }

                try
                {
                    files[name] = await ReadEntryAsync(entry, ct);
                }
                catch (InvalidDataException ex)
                {
                    problems.Add(new DossierProblem(name, null, "corrupt entry (cannot be decompressed or fails its CRC check): " + ex.Message));
                }
            }

            return files;
        }
    }

    /// <summary>True for a relative '/'-separated name without "..", backslashes, drive letters or control characters.</summary>
    public static bool IsSafe(string name) =>
        name.Length is > 0 and <= 1024
        && !name.StartsWith('/')
        && !name.Contains('\\')
        && !name.Contains(':')
        && !name.Any(char.IsControl)
        && !name.Split('/').Any(part => part is ".." or ".");

    private static async Task<byte[]> ReadEntryAsync(ZipArchiveEntry entry, CancellationToken ct)
    {
        await using var s = entry.Open();
        using var ms = new MemoryStream(entry.Length is > 0 and < int.MaxValue ? (int)entry.Length : 0);
        var buffer = new byte[81920];
        int read;
        while ((read = await s.ReadAsync(buffer, ct)) > 0)
        {
            if (ms.Length + read > entry.Length)
            {
                throw new InvalidDataException($"more bytes than the {entry.Length} the ZIP declares.");
            }

            ms.Write(buffer, 0, read);
        }

        return ms.ToArray();
    }
}
