using System.IO.Compression;
using System.Security.Cryptography;
using System.Text;
using EventReview.Core.Dossier;
using EventReview.Core.Evidence;

namespace EventReview.Dossier;

/// <summary>
/// Writes a case's dossier ZIP (format in <c>docs/formats/dossier.md</c>). Entries are written in a fixed order
/// (<c>dossier.json</c>, <c>index.html</c>, <c>summary.pdf</c>, <c>pictures/&lt;n&gt;.svg</c> by n,
/// <c>attachments/&lt;sha256 prefix&gt;-&lt;safe name&gt;.&lt;ext&gt;</c> by path (<see cref="AttachmentNames"/>), <c>manifest.json</c> last), all dated 1980-01-01 00:00, with no
/// directory entries and no extra fields, so exporting an unchanged case twice gives the same files and manifest
/// (only the value of the manifest's signature differs: ECDSA signatures are randomised). With a signer, the manifest
/// carries the server's signature (<see cref="DossierSignature"/>) over its listed files and the head it saw.
/// </summary>
public static class DossierExporter
{
    /// <summary>Time stamp of every ZIP entry (the earliest a ZIP can hold).</summary>
    public static readonly DateTimeOffset EntryTime = new(1980, 1, 1, 0, 0, 0, TimeSpan.Zero);

    /// <summary>
    /// Writes the ZIP to <paramref name="output"/>. <paramref name="openAttachment"/> opens an attachment's stored bytes
    /// by SHA-256 (for example <c>AttachmentStore.Open</c>), or returns null when it is missing.
    /// </summary>
    /// <exception cref="FileNotFoundException">When an attachment is missing from the store.</exception>
    /// <exception cref="InvalidDataException">When an attachment's stored bytes no longer match its hash (export refused).</exception>
    public static async Task ExportAsync(DossierDocument doc, Func<string, Stream?> openAttachment, Stream output, CancellationToken ct = default) =>
        await ExportAsync(doc, openAttachment, output, null, ct);

    /// <summary>As above, signing the manifest with <paramref name="signer"/> (the server's record key) when given.</summary>
    public static async Task ExportAsync(DossierDocument doc, Func<string, Stream?> openAttachment, Stream output, Core.Records.IRecordSigner? signer, CancellationToken ct = default)
    {
        ArgumentNullException.ThrowIfNull(doc);
        ArgumentNullException.ThrowIfNull(openAttachment);
        ArgumentNullException.ThrowIfNull(output);
        var listed = new List<DossierManifestFile>();
        using (var zip = new ZipArchive(output, ZipArchiveMode.Create, leaveOpen: true, entryNameEncoding: Encoding.UTF8))
        {
            await AddAsync(zip, DossierManifest.DossierFileName, DossierJson.Serialize(doc), listed, ct);
            await AddAsync(zip, "index.html", DossierHtml.Render(doc), listed, ct);
            await AddAsync(zip, "summary.pdf", DossierPdf.Render(doc), listed, ct);
            foreach (var name in doc.PictureSvgs.Keys.OrderBy(PictureNumber).ThenBy(k => k, StringComparer.Ordinal))
            {
                await AddAsync(zip, name, Encoding.UTF8.GetBytes(doc.PictureSvgs[name]), listed, ct);
            }

            var attachments = doc.Items.SelectMany(i => i.Evidence).Where(e => e.Kind == "attachment")
                .Select(e => (Path: DossierDocument.AttachmentPath(doc.SchemaVersion, e.ContentSha256, e.FileName), Sha: e.ContentSha256))
                .DistinctBy(a => a.Path, StringComparer.Ordinal).OrderBy(a => a.Path, StringComparer.Ordinal);
            foreach (var (path, sha) in attachments)
            {
                await AddAttachmentAsync(zip, path, sha, openAttachment, listed, ct);
            }

            var manifest = new DossierManifest(DossierDocument.CurrentSchemaVersion, doc.Case.CandidateId, doc.ChainHead,
                listed.OrderBy(f => f.Path, StringComparer.Ordinal).ToList(), doc.Timeline.Count == 0 ? 0 : doc.Timeline[^1].Sequence);
            if (signer is not null)
            {
                manifest = manifest with { Signature = Sign(manifest, signer) };
            }

            await AddAsync(zip, DossierManifest.FileName, DossierJson.Serialize(manifest), null, ct);
        }

        await output.FlushAsync(ct);
    }

    /// <summary>The signature of <paramref name="manifest"/> (without one) by <paramref name="signer"/>.</summary>
    public static DossierSignature Sign(DossierManifest manifest, Core.Records.IRecordSigner signer) =>
        new(signer.KeyId, Core.Records.RecordPublicKey.Algorithm, Convert.ToBase64String(signer.PublicKey), Convert.ToBase64String(signer.Sign(manifest.SignedText())));

    private static async Task AddAsync(ZipArchive zip, string name, byte[] bytes, List<DossierManifestFile>? listed, CancellationToken ct)
    {
        var entry = NewEntry(zip, name);
        await using (var s = entry.Open())
        {
            await s.WriteAsync(bytes, ct);
        }

        listed?.Add(new DossierManifestFile(name, Hashing.Sha256Hex(bytes), bytes.LongLength));
    }

    private static async Task AddAttachmentAsync(ZipArchive zip, string name, string sha, Func<string, Stream?> open, List<DossierManifestFile> listed, CancellationToken ct)
    {
        await using var source = open(sha) ?? throw new FileNotFoundException($"Attachment {sha} is missing from the attachment store; the dossier cannot be exported.", name);
        using var hash = IncrementalHash.CreateHash(HashAlgorithmName.SHA256);
        long length = 0;
        var entry = NewEntry(zip, name);
        await using (var target = entry.Open())
        {
            var buffer = new byte[81920];
            int read;
            while ((read = await source.ReadAsync(buffer, ct)) > 0)
            {
                hash.AppendData(buffer, 0, read);
                length += read;
                await target.WriteAsync(buffer.AsMemory(0, read), ct);
            }
        }

        var actual = Convert.ToHexStringLower(hash.GetHashAndReset());
        if (actual != sha)
        {
            throw new InvalidDataException($"Attachment {sha} in the store now hashes to {actual}: the stored file was altered; the dossier is not exported.");
        }

        listed.Add(new DossierManifestFile(name, sha, length));
    }

    private static ZipArchiveEntry NewEntry(ZipArchive zip, string name)
    {
        var entry = zip.CreateEntry(name, CompressionLevel.Optimal);
        entry.LastWriteTime = EntryTime;
        return entry;
    }

    private static int PictureNumber(string name)
    {
        var digits = new string(name.Where(char.IsAsciiDigit).ToArray());
        return int.TryParse(digits, out var n) ? n : int.MaxValue;
    }
}
