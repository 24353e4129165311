using System.Globalization;
using System.Text;

namespace EventReview.Core.Dossier;

/// <summary>
/// <c>manifest.json</c>: the schema version, the case, its chain head, and every other file of the ZIP with its
/// SHA-256 (lowercase hex) and size in bytes, in ordinal path order. Schema 2 adds the sequence number of the head
/// entry and the server's <see cref="DossierSignature"/> over <see cref="SignedText"/>.
/// </summary>
public sealed record DossierManifest(string SchemaVersion, string CandidateId, string ChainHead, IReadOnlyList<DossierManifestFile> Files,
    int? HeadSequence = null, DossierSignature? Signature = null)
{
    /// <summary>Name of the manifest inside the ZIP.</summary>
    public const string FileName = "manifest.json";

    /// <summary>Name of the machine-readable dossier inside the ZIP.</summary>
    public const string DossierFileName = "dossier.json";

    /// <summary>
    /// What the signature covers, as UTF-8: the lines <c>eventreview-dossier-manifest-v2</c>, schema version, candidate
    /// id, head sequence, chain head, then one line per listed file <c>path SHA-256 size</c>, each line ending in '\n'.
    /// </summary>
    public byte[] SignedText()
    {
        var sb = new StringBuilder("eventreview-dossier-manifest-v2\n");
        sb.Append(SchemaVersion).Append('\n').Append(CandidateId).Append('\n')
          .Append((HeadSequence ?? 0).ToString(CultureInfo.InvariantCulture)).Append('\n').Append(ChainHead).Append('\n');
        foreach (var f in Files)
        {
            sb.Append(f?.Path).Append(' ').Append(f?.Sha256).Append(' ').Append((f?.SizeBytes ?? 0).ToString(CultureInfo.InvariantCulture)).Append('\n');
        }

        return Encoding.UTF8.GetBytes(sb.ToString());
    }
}
