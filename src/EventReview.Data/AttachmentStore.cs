using System.Security.Cryptography;

namespace EventReview.Data;

/// <summary>
/// Content-addressed file store under <c>{DataDirectory}/attachments/ab/abcdef...</c> (the SHA-256 in lowercase hex).
/// Files are never stored under a user-supplied name. A save writes to a temporary file, flushes it to disk and
/// moves it into place, so an acknowledged save survives a crash.
/// </summary>
public sealed class AttachmentStore(DatabaseSettings settings)
{
    private readonly string _root = settings.AttachmentDirectory;

    /// <summary>Stores the stream's bytes; returns the hash and length. Refuses more than <paramref name="maxBytes"/>.</summary>
    /// <exception cref="AttachmentTooLargeException">When the stream is longer than the limit (nothing is kept).</exception>
    public async Task<(string Sha256, long Length)> SaveAsync(Stream content, long maxBytes, CancellationToken ct = default)
    {
        Directory.CreateDirectory(_root);
        var temp = Path.Combine(_root, $".incoming-{Guid.NewGuid():N}");
        try
        {
            long length = 0;
            using var sha = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
            // Reads may wait on the network (an upload in progress); writes go to the page cache and are done in place:
            // on Linux an "asynchronous" file write is a synchronous one on another thread, which only adds a hop.
            using (var file = new FileStream(temp, FileMode.CreateNew, FileAccess.Write, FileShare.None, bufferSize: 0))
            {
                var buffer = new byte[81920];
                int read;
                while ((read = await content.ReadAsync(buffer, ct)) > 0)
                {
                    length += read;
                    if (length > maxBytes)
                    {
                        throw new AttachmentTooLargeException(maxBytes);
                    }

                    sha.AppendData(buffer, 0, read);
                    file.Write(buffer, 0, read);
                }

                file.Flush(flushToDisk: true);
            }

            var hash = Convert.ToHexStringLower(sha.GetHashAndReset());
            var final = PathFor(hash);
            Directory.CreateDirectory(Path.GetDirectoryName(final)!);
            if (File.Exists(final))
            {
                File.Delete(temp);
            }
            else
            {
                File.Move(temp, final);
            }

            return (hash, length);
        }
        finally
        {
            if (File.Exists(temp))
            {
                File.Delete(temp);
            }
        }
    }

    /// <summary>
    /// Deletes the temporary files of uploads that never finished (<c>.incoming-*</c> at the top of the store, left by a
    /// process that was killed while receiving a file). Call at start-up, before the app takes requests: no upload of
    /// this store is in progress then, and no acknowledged file is ever a temporary one.
    /// </summary>
    /// <returns>The names of the files removed.</returns>
    public IReadOnlyList<string> RemoveOrphanedUploads()
    {
        if (!Directory.Exists(_root))
        {
            return [];
        }

        var removed = new List<string>();
        foreach (var path in Directory.EnumerateFiles(_root, ".incoming-*", SearchOption.TopDirectoryOnly))
        {
            try
            {
                File.Delete(path);
                removed.Add(Path.GetFileName(path));
            }
            catch (IOException)
            {
                // Held open by something else: left for the next start.
            }
        }

        return removed;
    }

    /// <summary>Path of a stored file by hash (the file may not exist).</summary>
    public string PathFor(string sha256)
    {
        if (!Core.Evidence.Hashing.IsSha256Hex(sha256))
        {
            throw new ArgumentException("Not a SHA-256 hex string.", nameof(sha256));
        }

        return Path.Combine(_root, sha256[..2], sha256);
    }

    /// <summary>Opens a stored file for reading, or null when it is missing.</summary>
    public Stream? Open(string sha256)
    {
        var path = PathFor(sha256);
        return File.Exists(path) ? File.OpenRead(path) : null;
    }

    /// <summary>True when the stored bytes still hash to <paramref name="sha256"/>.</summary>
    public bool Verify(string sha256)
    {
        using var s = Open(sha256);
        return s is not null && Core.Evidence.Hashing.Sha256Hex(s) == sha256;
    }
}
