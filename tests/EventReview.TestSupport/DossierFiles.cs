using System.Text;
using System.Text.Json.Nodes;
using EventReview.Core.Dossier;
using EventReview.Core.Evidence;
using EventReview.Core.Records;

namespace EventReview.TestSupport;

/// <summary>
/// Makes the files of a dossier in memory (dossier.json, pictures, attachments, a manifest signed by <see cref="TestSigner"/>)
/// and alters them as a tamperer would: someone without the key can recompute the manifest but not its signature.
/// </summary>
public static class DossierFiles
{
    public static Dictionary<string, byte[]> From(DossierDocument doc, IReadOnlyDictionary<string, byte[]> attachmentsBySha)
    {
        var files = new Dictionary<string, byte[]>(StringComparer.Ordinal)
        {
            [DossierManifest.DossierFileName] = DossierJson.Serialize(doc),
        };
        foreach (var (name, svg) in doc.PictureSvgs)
        {
            files[name] = Encoding.UTF8.GetBytes(svg);
        }

        foreach (var e in doc.Items.SelectMany(i => i.Evidence).Where(e => e.AttachmentPath is not null))
        {
            files[e.AttachmentPath!] = attachmentsBySha[e.ContentSha256];
        }

        Reseal(files, doc.ChainHead, doc.Case.CandidateId, doc.Timeline.Count == 0 ? 0 : doc.Timeline[^1].Sequence, TestSigner.Instance, doc.SchemaVersion);
        return files;
    }

    /// <summary>The trusted keys of the tests: the key the untouched dossiers are signed with.</summary>
    public static IReadOnlyList<RecordPublicKey> Trusted => [TestSigner.Instance.Public];

    /// <summary>Verifies against <see cref="Trusted"/>.</summary>
    public static DossierVerification Verify(Dictionary<string, byte[]> files) => DossierVerifier.Verify(files, Trusted);

    /// <summary>
    /// Rewrites the manifest over the current files (what someone altering the dossier would also do), signed by
    /// <paramref name="signer"/>: by default none (a forger does not hold the key), or a key of the forger's own.
    /// </summary>
    public static void Reseal(Dictionary<string, byte[]> files, string chainHead, string candidateId, int? headSequence = null, IRecordSigner? signer = null,
        string schemaVersion = DossierDocument.CurrentSchemaVersion)
    {
        if (headSequence is null && files.TryGetValue(DossierManifest.FileName, out var old))
        {
            headSequence = DossierJson.Deserialize<DossierManifest>(old).HeadSequence;
        }

        files.Remove(DossierManifest.FileName);
        var list = files.OrderBy(f => f.Key, StringComparer.Ordinal)
            .Select(f => new DossierManifestFile(f.Key, Hashing.Sha256Hex(f.Value), f.Value.LongLength)).ToList();
        var manifest = new DossierManifest(schemaVersion, candidateId, chainHead, list, headSequence);
        if (signer is not null)
        {
            manifest = manifest with
            {
                Signature = new DossierSignature(signer.KeyId, RecordPublicKey.Algorithm, Convert.ToBase64String(signer.PublicKey), Convert.ToBase64String(signer.Sign(manifest.SignedText()))),
            };
        }

        files[DossierManifest.FileName] = DossierJson.Serialize(manifest);
    }

    /// <summary>Edits dossier.json as JSON and reseals the manifest (keeping the manifest's chain head).</summary>
    public static void EditDossier(Dictionary<string, byte[]> files, Action<JsonNode> edit)
    {
        var node = JsonNode.Parse(files[DossierManifest.DossierFileName])!;
        var manifest = JsonNode.Parse(files[DossierManifest.FileName])!;
        edit(node);
        files[DossierManifest.DossierFileName] = Encoding.UTF8.GetBytes(node.ToJsonString(DossierJson.Options) + "\n");
        Reseal(files, manifest["chainHead"]!.GetValue<string>(), manifest["candidateId"]!.GetValue<string>());
    }
}
