using System.Security.Cryptography;
using System.Text.Json;
using EventReview.Core.Records;

namespace EventReview.Data.Records;

/// <summary>
/// The record keys in a folder of their own (default <c>keys/</c> in the data folder; keep it where the database's
/// readers and writers cannot reach, ideally another machine or a vault): <c>record-keys.json</c> lists every public key
/// with its validity (<c>eventreview-record-keys/1</c>), and each key's private part is a PKCS#8 PEM file
/// <c>record-key-&lt;first 16 digits of its fingerprint&gt;.pem</c>. The folder is made readable by its owner only
/// (mode 700, files 600). Rotation (<see cref="Rotate"/>) ends the current key's validity and starts a new one; old keys
/// stay listed and keep verifying what they signed. A ring whose private files are absent still lists and checks public
/// keys, but cannot sign or check entry MACs.
/// </summary>
public sealed class FileRecordKeyRing : IRecordKeyRing, IDisposable
{
    public const string ListFileName = "record-keys.json";
    public const string Format = "eventreview-record-keys/1";

    private static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web) { WriteIndented = true };
    private readonly List<(RecordPublicKey Public, FileRecordKey? Private)> _keys = [];

    private FileRecordKeyRing(string? folder)
    {
        Folder = folder;
    }

    /// <summary>The key folder, or null for a ring of public keys only.</summary>
    public string? Folder { get; }

    public IRecordSigner? Current => _keys.LastOrDefault(k => k.Public.ValidUntil is null).Private;

    public IReadOnlyList<RecordPublicKey> Keys => _keys.Select(k => k.Public).ToList();

    public bool? MacMatches(string keyId, string data, string mac)
    {
        var key = _keys.FirstOrDefault(k => k.Public.Fingerprint == keyId).Private;
        if (key is null)
        {
            return null;
        }

        var expected = key.Mac(data);
        return expected.Length == mac.Length && CryptographicOperations.FixedTimeEquals(System.Text.Encoding.ASCII.GetBytes(expected), System.Text.Encoding.ASCII.GetBytes(mac));
    }

    /// <summary>Reads the keys in <paramref name="folder"/> (none when it holds no key list).</summary>
    /// <exception cref="InvalidDataException">When the key list or a private key file cannot be read.</exception>
    public static FileRecordKeyRing Open(string folder)
    {
        var ring = new FileRecordKeyRing(Path.GetFullPath(folder));
        var list = Path.Combine(ring.Folder!, ListFileName);
        if (!File.Exists(list))
        {
            return ring;
        }

        KeyList? parsed;
        try
        {
            parsed = JsonSerializer.Deserialize<KeyList>(File.ReadAllBytes(list), Json);
        }
        catch (JsonException ex)
        {
            throw new InvalidDataException($"{list} is not a record key list: {ex.Message}", ex);
        }

        if (parsed?.Format != Format)
        {
            throw new InvalidDataException($"{list} is not a record key list ({Format}).");
        }

        foreach (var k in parsed.Keys)
        {
            var pub = new RecordPublicKey(Convert.FromBase64String(k.PublicKey), k.ValidFrom, k.ValidUntil);
            if (pub.Fingerprint != k.Fingerprint)
            {
                throw new InvalidDataException($"{list}: key {k.Fingerprint} holds a public key whose fingerprint is {pub.Fingerprint}.");
            }

            FileRecordKey? priv = null;
            var pem = Path.Combine(ring.Folder!, k.PrivateKeyFile);
            if (File.Exists(pem))
            {
                try
                {
                    priv = FileRecordKey.FromPem(File.ReadAllText(pem));
                }
                catch (Exception ex) when (ex is CryptographicException or ArgumentException)
                {
                    throw new InvalidDataException($"{pem} is not a P-256 private key: {ex.Message}", ex);
                }

                if (priv.KeyId != pub.Fingerprint)
                {
                    throw new InvalidDataException($"{pem} holds key {priv.KeyId}, not {pub.Fingerprint} as {ListFileName} says.");
                }
            }

            ring._keys.Add((pub, priv));
        }

        return ring;
    }

    /// <summary>A ring of public keys only (to check dossier signatures and witness lines).</summary>
    public static FileRecordKeyRing PublicOnly(IEnumerable<RecordPublicKey> keys)
    {
        var ring = new FileRecordKeyRing(null);
        ring._keys.AddRange(keys.Select(k => (k, (FileRecordKey?)null)));
        return ring;
    }

    /// <summary>
    /// Makes sure there is a key to sign with: creates the first key when the folder holds none and the record holds no
    /// signature yet. Refuses (rather than silently starting a new key) when the record is already signed but the key
    /// is missing, or when the listed current key's private file is absent.
    /// </summary>
    /// <exception cref="InvalidOperationException">When no key can sign; the message says what is missing.</exception>
    public void EnsureSigningKey(DateTimeOffset now, bool recordIsSigned)
    {
        if (Current is not null)
        {
            return;
        }

        if (Folder is null)
        {
            throw new InvalidOperationException("This key ring holds public keys only; it cannot sign.");
        }

        if (_keys.Count > 0)
        {
            var current = _keys.LastOrDefault(k => k.Public.ValidUntil is null).Public ?? _keys[^1].Public;
            throw new InvalidOperationException($"The record key {current.Fingerprint} is listed in {Path.Combine(Folder, ListFileName)} but its private file is missing; restore it (or rotate to a new key with 'eventreview keys rotate').");
        }

        if (recordIsSigned)
        {
            throw new InvalidOperationException($"The record is already signed, but the key folder {Folder} holds no record key. Point EventReview:Records:KeyDirectory at the folder that holds it (or restore it there); a new key would leave the existing signatures unverifiable.");
        }

        Add(FileRecordKey.Generate(), now);
    }

    /// <summary>Ends the current key's validity at <paramref name="now"/> and starts a new key; returns the new key's fingerprint.</summary>
    public string Rotate(DateTimeOffset now)
    {
        if (Folder is null)
        {
            throw new InvalidOperationException("This key ring holds public keys only; it cannot rotate.");
        }

        for (var i = 0; i < _keys.Count; i++)
        {
            if (_keys[i].Public.ValidUntil is null)
            {
                _keys[i] = (_keys[i].Public with { ValidUntil = now }, _keys[i].Private);
            }
        }

        var key = FileRecordKey.Generate();
        Add(key, now);
        return key.KeyId;
    }

    private void Add(FileRecordKey key, DateTimeOffset now)
    {
        CreatePrivateFolder(Folder!);
        var file = $"record-key-{key.KeyId[..16]}.pem";
        WritePrivate(Path.Combine(Folder!, file), key.ToPem());
        _keys.Add((new RecordPublicKey(key.PublicKey, now, null), key));
        var list = new KeyList(Format, _keys.Select(k => new KeyListEntry(k.Public.Fingerprint, Convert.ToBase64String(k.Public.SubjectPublicKeyInfo),
            k.Public.ValidFrom, k.Public.ValidUntil, $"record-key-{k.Public.Fingerprint[..16]}.pem")).ToList());
        WritePrivate(Path.Combine(Folder!, ListFileName), JsonSerializer.Serialize(list, Json) + "\n");
    }

    /// <summary>Creates a folder readable by its owner only (on Unix).</summary>
    public static void CreatePrivateFolder(string folder)
    {
        if (OperatingSystem.IsWindows())
        {
            Directory.CreateDirectory(folder);
            return;
        }

        Directory.CreateDirectory(folder, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);
        File.SetUnixFileMode(folder, UnixFileMode.UserRead | UnixFileMode.UserWrite | UnixFileMode.UserExecute);
    }

    /// <summary>Writes a file readable by its owner only, replacing it atomically.</summary>
    private static void WritePrivate(string path, string text)
    {
        var temp = path + ".tmp";
        var options = new FileStreamOptions { Mode = FileMode.Create, Access = FileAccess.Write };
        if (!OperatingSystem.IsWindows())
        {
            options.UnixCreateMode = UnixFileMode.UserRead | UnixFileMode.UserWrite;
        }

        using (var s = new StreamWriter(new FileStream(temp, options)))
        {
            s.Write(text);
            s.Flush();
            ((FileStream)s.BaseStream).Flush(flushToDisk: true);
        }

        File.Move(temp, path, overwrite: true);
    }

    public void Dispose()
    {
        foreach (var (_, key) in _keys)
        {
            key?.Dispose();
        }
    }

    private sealed record KeyList(string Format, List<KeyListEntry> Keys);

    private sealed record KeyListEntry(string Fingerprint, string PublicKey, DateTimeOffset ValidFrom, DateTimeOffset? ValidUntil, string PrivateKeyFile);
}
