using System.Text.Json;
using EventReview.Core.Evidence;

namespace EventReview.Core.Dossier;

/// <summary>
/// The manifest part of <see cref="DossierVerifier"/>: <c>manifest.json</c> lists every other file exactly once, no
/// listed file is missing, no file is unlisted, and each file's SHA-256 and size match.
/// </summary>
internal static class DossierManifestCheck
{
    public static DossierManifest? Check(IReadOnlyDictionary<string, byte[]> files, List<DossierProblem> problems)
    {
        const string m = DossierManifest.FileName;
        if (!files.TryGetValue(m, out var bytes))
        {
            problems.Add(new DossierProblem(m, null, "missing from the ZIP: file hashes cannot be checked."));
            return null;
        }

        DossierManifest manifest;
        try
        {
            manifest = DossierJson.Deserialize<DossierManifest>(bytes);
        }
        catch (JsonException ex)
        {
            problems.Add(new DossierProblem(m, ex.Path, "not a valid manifest: " + ex.Message));
            return null;
        }

        if (!DossierDocument.Reads(manifest.SchemaVersion))
        {
            problems.Add(new DossierProblem(m, "schemaVersion", $"is '{manifest.SchemaVersion}'; expected '{DossierDocument.CurrentSchemaVersion}'."));
        }

        var listed = new HashSet<string>(StringComparer.Ordinal);
        foreach (var f in manifest.Files)
        {
            if (f is null)
            {
                problems.Add(new DossierProblem(m, "files", "holds an empty entry."));
                continue;
            }

            if (!listed.Add(f.Path))
            {
                problems.Add(new DossierProblem(m, f.Path, "is listed twice."));
                continue;
            }

            if (f.Path == m)
            {
                problems.Add(new DossierProblem(m, f.Path, "the manifest must not list itself."));
                continue;
            }

            if (!files.TryGetValue(f.Path, out var content))
            {
                problems.Add(new DossierProblem(f.Path, null, "listed in the manifest but missing from the ZIP."));
                continue;
            }

            var sha = Hashing.Sha256Hex(content);
            if (!string.Equals(sha, f.Sha256, StringComparison.Ordinal))
            {
                problems.Add(new DossierProblem(f.Path, null, $"SHA-256 is {sha}; the manifest says {f.Sha256} (the file was altered)."));
            }
            else if (content.LongLength != f.SizeBytes)
            {
                problems.Add(new DossierProblem(f.Path, null, $"is {content.LongLength} bytes; the manifest says {f.SizeBytes}."));
            }
        }

        foreach (var path in files.Keys.Where(p => p != m && !listed.Contains(p)).Order(StringComparer.Ordinal))
        {
            problems.Add(new DossierProblem(path, null, "is in the ZIP but not listed in the manifest (extra file)."));
        }

        return manifest;
    }
}
