using System.Security.Cryptography;
using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests;

public sealed class AttachmentStoreTests : IDisposable
{
    private readonly TempFolder _folder = new("er-files");
    private readonly AttachmentStore _store;

    public AttachmentStoreTests() => _store = new AttachmentStore(DatabaseSettings.ForSqlite(_folder.Path));

    public void Dispose() => _folder.Dispose();

    private string Root => Path.Combine(_folder.Path, "attachments");

    private IEnumerable<string> StoredFiles() =>
        Directory.Exists(Root) ? Directory.EnumerateFiles(Root, "*", SearchOption.AllDirectories) : [];

    [Fact]
    public async Task A_file_is_stored_under_its_sha256_in_a_two_letter_folder()
    {
        var bytes = "abc"u8.ToArray();

        var (sha, length) = await _store.SaveAsync(new MemoryStream(bytes), 1024);

        // FIPS 180-2, appendix B.1: SHA-256("abc").
        Assert.Equal("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", sha);
        Assert.Equal(3, length);
        var path = Path.Combine(Root, "ba", sha);
        Assert.Equal(path, _store.PathFor(sha));
        Assert.Equal(bytes, await File.ReadAllBytesAsync(path));
        Assert.Equal([path], StoredFiles());
    }

    [Fact]
    public async Task An_empty_file_is_stored_under_the_hash_of_nothing()
    {
        var (sha, length) = await _store.SaveAsync(new MemoryStream(), 10);

        // FIPS 180-2 family: SHA-256 of the empty message (well-known constant).
        Assert.Equal("e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855", sha);
        Assert.Equal(0, length);
        Assert.True(_store.Verify(sha));
    }

    [Fact]
    public async Task Storing_the_same_bytes_twice_keeps_one_file_and_no_temporary_files()
    {
        var bytes = RandomNumberGenerator.GetBytes(300_000);

        var first = await _store.SaveAsync(new MemoryStream(bytes), 1_000_000);
        var second = await _store.SaveAsync(new MemoryStream(bytes), 1_000_000);

        Assert.Equal(first, second);
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(bytes)), first.Sha256);
        Assert.Single(StoredFiles());
    }

    [Fact]
    public async Task Different_bytes_get_different_files()
    {
        var a = await _store.SaveAsync(new MemoryStream([1, 2, 3]), 10);
        var b = await _store.SaveAsync(new MemoryStream([1, 2, 4]), 10);

        Assert.NotEqual(a.Sha256, b.Sha256);
        Assert.Equal(2, StoredFiles().Count());
    }

    [Fact]
    public async Task A_file_exactly_at_the_limit_is_accepted()
    {
        var (_, length) = await _store.SaveAsync(new MemoryStream(new byte[200_000]), 200_000);

        Assert.Equal(200_000, length);
    }

    [Fact]
    public async Task A_file_over_the_limit_is_refused_and_nothing_is_left_behind()
    {
        var ex = await Assert.ThrowsAsync<AttachmentTooLargeException>(() => _store.SaveAsync(new MemoryStream(new byte[200_001]), 200_000));

        Assert.Equal(200_000, ex.LimitBytes);
        Assert.Empty(StoredFiles());
    }

    [Fact]
    public async Task The_size_limit_message_states_the_limit_in_megabytes()
    {
        var ex = await Assert.ThrowsAsync<AttachmentTooLargeException>(() => _store.SaveAsync(new MemoryStream(new byte[3 * 1024 * 1024]), 2 * 1024 * 1024));

        Assert.Contains("2 MB", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("../../etc/passwd")]
    [InlineData("BA7816BF8F01CFEA414140DE5DAE2223B00361A396177A9CB410FF61F20015AD")]
    [InlineData("")]
    public void A_path_is_only_made_from_a_real_sha256(string name)
    {
        Assert.Throws<ArgumentException>(() => _store.PathFor(name));
    }

    [Fact]
    public async Task Opening_gives_back_the_bytes_and_a_missing_hash_gives_null()
    {
        var (sha, _) = await _store.SaveAsync(new MemoryStream("hello"u8.ToArray()), 10);

        await using (var s = _store.Open(sha))
        {
            Assert.NotNull(s);
            using var reader = new StreamReader(s);
            Assert.Equal("hello", await reader.ReadToEndAsync());
        }

        Assert.Null(_store.Open(new string('0', 64)));
        Assert.False(_store.Verify(new string('0', 64)));
    }

    [Fact]
    public async Task Verification_notices_a_stored_file_whose_bytes_changed()
    {
        var (sha, _) = await _store.SaveAsync(new MemoryStream("original"u8.ToArray()), 100);
        Assert.True(_store.Verify(sha));

        await File.WriteAllTextAsync(_store.PathFor(sha), "tampered");

        Assert.False(_store.Verify(sha));
    }

    [Fact]
    public async Task Removing_orphaned_uploads_deletes_only_unfinished_temporary_files()
    {
        var (sha, _) = await _store.SaveAsync(new MemoryStream("kept"u8.ToArray()), 1024);
        var orphans = new[] { ".incoming-0123abcd", ".incoming-" + Guid.NewGuid().ToString("N") };
        foreach (var o in orphans)
        {
            await File.WriteAllBytesAsync(Path.Combine(Root, o), new byte[100]);
        }

        var other = Path.Combine(Root, "notes.txt");
        await File.WriteAllTextAsync(other, "not an upload");

        var removed = _store.RemoveOrphanedUploads();

        Assert.Equal(orphans.Order(StringComparer.Ordinal), removed.Order(StringComparer.Ordinal));
        Assert.Equal(new[] { _store.PathFor(sha), other }.Order(StringComparer.Ordinal), StoredFiles().Order(StringComparer.Ordinal));
        Assert.Empty(_store.RemoveOrphanedUploads());
    }

    [Fact]
    public void Removing_orphaned_uploads_from_a_store_never_used_does_nothing()
    {
        Assert.Empty(_store.RemoveOrphanedUploads());
        Assert.False(Directory.Exists(Root));
    }
}
