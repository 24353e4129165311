using System.Text;
using System.Text.Json.Nodes;
using EventReview.Core.Dossier;
using EventReview.Core.Evidence;

namespace EventReview.Core.Tests.Dossier;

/// <summary>Makes the files of a dossier in memory (dossier.json, pictures, attachments, manifest) and alters them as a tamperer would.</summary>
internal static class DossierFiles
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

        Reseal(files, doc.ChainHead, doc.Case.CandidateId);
        return files;
    }

    /// <summary>Rewrites the manifest over the current files (what someone altering the dossier would also do).</summary>
    public static void Reseal(Dictionary<string, byte[]> files, string chainHead, string candidateId)
    {
        files.Remove(DossierManifest.FileName);
        var list = files.OrderBy(f => f.Key, StringComparer.Ordinal)
            .Select(f => new DossierManifestFile(f.Key, Hashing.Sha256Hex(f.Value), f.Value.LongLength)).ToList();
        files[DossierManifest.FileName] = DossierJson.Serialize(new DossierManifest(DossierDocument.CurrentSchemaVersion, candidateId, chainHead, list));
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
