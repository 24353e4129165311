using EventReview.Core.Records;
using EventReview.Data.Records;
using EventReview.Data.Tests.Fixtures;

namespace EventReview.Data.Tests.Records;

public sealed class FileRecordKeyRingTests : IDisposable
{
    private static readonly DateTimeOffset T = new(2031, 5, 1, 8, 0, 0, TimeSpan.Zero);
    private readonly TempFolder _folder = new("er-keys");

    private string Keys => Path.Combine(_folder.Path, "keys");

    public void Dispose() => _folder.Dispose();

    [Fact]
    public void The_first_key_is_made_in_a_folder_only_its_owner_can_read()
    {
        using var ring = FileRecordKeyRing.Open(Keys);
        Assert.Null(ring.Current);

        ring.EnsureSigningKey(T, recordIsSigned: false);

        Assert.NotNull(ring.Current);
        var key = Assert.Single(ring.Keys);
        Assert.Equal((T, (DateTimeOffset?)null), (key.ValidFrom, key.ValidUntil));
        Assert.Equal(RecordKeyFingerprint.Of(key.SubjectPublicKeyInfo), ring.Current!.KeyId);
        if (!OperatingSystem.IsWindows())
        {
            Assert.Equal(UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute, File.GetUnixFileMode(Keys));
            foreach (var f in Directory.GetFiles(Keys))
            {
                Assert.Equal(UnixFileMode.UserRead | UnixFileMode.UserWrite, File.GetUnixFileMode(f));
            }
        }
    }

    [Fact]
    public void A_reopened_ring_signs_and_checks_with_the_same_key()
    {
        string mac, fingerprint;
        byte[] signature;
        using (var ring = FileRecordKeyRing.Open(Keys))
        {
            ring.EnsureSigningKey(T, false);
            mac = ring.Current!.Mac("entry");
            signature = ring.Current.Sign("head"u8.ToArray());
            fingerprint = ring.Current.KeyId;
        }

        using var again = FileRecordKeyRing.Open(Keys);
        Assert.Equal(fingerprint, again.Current!.KeyId);
        Assert.True(again.MacMatches(fingerprint, "entry", mac));
        Assert.False(again.MacMatches(fingerprint, "entry!", mac));
        Assert.Null(again.MacMatches(new string('0', 64), "entry", mac));
        Assert.True(again.Keys[0].Verifies("head"u8.ToArray(), signature));
        Assert.False(again.Keys[0].Verifies("heads"u8.ToArray(), signature));
    }

    [Fact]
    public void Rotation_starts_a_new_key_and_keeps_the_old_one_verifying_what_it_signed()
    {
        using var ring = FileRecordKeyRing.Open(Keys);
        ring.EnsureSigningKey(T, false);
        var old = ring.Current!;
        var mac = old.Mac("old entry");
        var signature = old.Sign("old head"u8.ToArray());

        var newer = ring.Rotate(T.AddDays(30));

        using var reopened = FileRecordKeyRing.Open(Keys);
        Assert.Equal(newer, reopened.Current!.KeyId);
        Assert.NotEqual(old.KeyId, newer);
        Assert.Equal(2, reopened.Keys.Count);
        Assert.Equal((T, (DateTimeOffset?)T.AddDays(30)), (reopened.Keys[0].ValidFrom, reopened.Keys[0].ValidUntil));
        Assert.Null(reopened.Keys[1].ValidUntil);
        Assert.True(reopened.MacMatches(old.KeyId, "old entry", mac));
        Assert.True(reopened.Keys[0].Verifies("old head"u8.ToArray(), signature));
    }

    [Fact]
    public void No_new_key_is_made_silently_for_a_record_that_is_already_signed()
    {
        using var ring = FileRecordKeyRing.Open(Keys);

        var ex = Assert.Throws<InvalidOperationException>(() => ring.EnsureSigningKey(T, recordIsSigned: true));

        Assert.Contains("already signed", ex.Message, StringComparison.Ordinal);
        Assert.Contains(Keys, ex.Message, StringComparison.Ordinal);
        Assert.False(File.Exists(Path.Combine(Keys, FileRecordKeyRing.ListFileName)));
    }

    [Fact]
    public void A_listed_key_whose_private_file_is_gone_verifies_signatures_but_cannot_sign_or_check_macs()
    {
        string fingerprint;
        using (var ring = FileRecordKeyRing.Open(Keys))
        {
            ring.EnsureSigningKey(T, false);
            fingerprint = ring.Current!.KeyId;
        }

        File.Delete(Directory.GetFiles(Keys, "record-key-*.pem").Single());
        using var publicOnly = FileRecordKeyRing.Open(Keys);

        Assert.Null(publicOnly.Current);
        Assert.Null(publicOnly.MacMatches(fingerprint, "x", "y"));
        var ex = Assert.Throws<InvalidOperationException>(() => publicOnly.EnsureSigningKey(T, false));
        Assert.Contains("private file is missing", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void A_key_list_that_does_not_match_its_key_file_is_refused()
    {
        using (var ring = FileRecordKeyRing.Open(Keys))
        {
            ring.EnsureSigningKey(T, false);
        }

        var pem = Directory.GetFiles(Keys, "record-key-*.pem").Single();
        File.WriteAllText(pem, FileRecordKey.Generate().ToPem());

        var ex = Assert.Throws<InvalidDataException>(() => FileRecordKeyRing.Open(Keys));
        Assert.Contains("holds key", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Public_keys_are_read_back_from_pem_and_from_the_key_list()
    {
        using var ring = FileRecordKeyRing.Open(Keys);
        ring.EnsureSigningKey(T, false);
        var pem = Path.Combine(_folder.Path, "key.pem");
        File.WriteAllText(pem, ring.Keys[0].Pem());

        Assert.Equal(ring.Current!.KeyId, Assert.Single(PublicKeyFile.Read(pem)).Fingerprint);
        Assert.Equal(ring.Current.KeyId, Assert.Single(PublicKeyFile.Read(Path.Combine(Keys, FileRecordKeyRing.ListFileName))).Fingerprint);
        File.WriteAllText(pem, "not a key");
        Assert.Throws<InvalidDataException>(() => PublicKeyFile.Read(pem));
    }
}
