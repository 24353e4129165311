namespace EventReview.Core.Dossier;

/// <summary>One file listed in the manifest: path inside the ZIP ('/' separated), SHA-256 (lowercase hex), size in bytes.</summary>
public sealed record DossierManifestFile(string Path, string Sha256, long SizeBytes);
