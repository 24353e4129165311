namespace EventReview.Core.Dossier;

/// <summary>
/// <c>manifest.json</c>: the schema version, the case, its chain head, and every other file of the ZIP with its
/// SHA-256 (lowercase hex) and size in bytes, in ordinal path order.
/// </summary>
public sealed record DossierManifest(string SchemaVersion, string CandidateId, string ChainHead, IReadOnlyList<DossierManifestFile> Files)
{
    /// <summary>Name of the manifest inside the ZIP.</summary>
    public const string FileName = "manifest.json";

    /// <summary>Name of the machine-readable dossier inside the ZIP.</summary>
    public const string DossierFileName = "dossier.json";
}
