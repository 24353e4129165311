using System.Text.Json;
using EventReview.Core.Records;

namespace EventReview.Core.Dossier;

/// <summary>
/// Verifies an exported dossier offline, from the files of its ZIP (path to bytes), without the database:
/// <list type="number">
/// <item><c>manifest.json</c> lists every other file exactly once with its SHA-256 and size (<see cref="DossierManifestCheck"/>);</item>
/// <item><c>dossier.json</c> has schema version <see cref="DossierDocument.CurrentSchemaVersion"/> (or the legacy 1);</item>
/// <item>the timeline's hash chain recomputes entry by entry and ends at the chain head of the dossier and the manifest (<see cref="DossierTimelineCheck"/>);</item>
/// <item>every note, link, attachment, computation record, picture, evidence fingerprint, current sign-off and frozen
/// configuration checks out (<see cref="DossierContentCheck"/>);</item>
/// <item>the case, items, rows and stale marks are what the facts of the timeline say, and the shown totals recompute (<see cref="DossierRecordCheck"/>);</item>
/// <item>the manifest carries a signature by one of the trusted keys (<see cref="DossierSignatureCheck"/>).</item>
/// </list>
/// The result is "valid" only when everything matches and the signature is by a trusted key; "unsigned" when everything
/// matches but there is no such signature; otherwise "invalid". Never throws for bad content.
/// </summary>
public static class DossierVerifier
{
    /// <summary>Verifies the dossier's files (paths '/' separated, as in the ZIP) against the given trusted public keys.</summary>
    public static DossierVerification Verify(IReadOnlyDictionary<string, byte[]> files, IReadOnlyList<RecordPublicKey>? trustedKeys = null)
    {
        ArgumentNullException.ThrowIfNull(files);
        var problems = new List<DossierProblem>();
        var manifest = DossierManifestCheck.Check(files, problems);
        var (signedBy, signature) = DossierSignatureCheck.Check(manifest, trustedKeys ?? [], problems);
        if (Read(files, problems) is not { } doc)
        {
            return DossierVerification.Of(problems, signedBy, signature);
        }

        if (manifest is not null && manifest.SchemaVersion != doc.SchemaVersion)
        {
            problems.Add(new DossierProblem(DossierManifest.FileName, "schemaVersion", $"is '{manifest.SchemaVersion}' but dossier.json is '{doc.SchemaVersion}'."));
        }

        try
        {
            DossierTimelineCheck.Check(doc, manifest, problems);
            foreach (var item in doc.Items)
            {
                DossierContentCheck.CheckItem(doc.SchemaVersion, item, files, problems);
            }

            DossierContentCheck.CheckConfigurations(doc, problems);
            DossierRecordCheck.Check(doc, problems);
        }
        catch (Exception ex) when (ex is NullReferenceException or ArgumentException or FormatException or InvalidOperationException or OverflowException)
        {
            problems.Add(new DossierProblem(DossierManifest.DossierFileName, null, "could not be checked: " + ex.Message));
        }

        return DossierVerification.Of(problems, signedBy, signature);
    }

    /// <summary>Reads <c>dossier.json</c>, or adds a problem and returns null.</summary>
    public static DossierDocument? Read(IReadOnlyDictionary<string, byte[]> files, List<DossierProblem> problems)
    {
        ArgumentNullException.ThrowIfNull(files);
        ArgumentNullException.ThrowIfNull(problems);
        if (!files.TryGetValue(DossierManifest.DossierFileName, out var dossierBytes))
        {
            problems.Add(new DossierProblem(DossierManifest.DossierFileName, null, "missing from the ZIP."));
            return null;
        }

        DossierDocument doc;
        try
        {
            doc = DossierJson.Deserialize<DossierDocument>(dossierBytes);
        }
        catch (JsonException ex)
        {
            problems.Add(new DossierProblem(DossierManifest.DossierFileName, ex.Path, "not a valid dossier document: " + ex.Message));
            return null;
        }

        if (!DossierDocument.Reads(doc.SchemaVersion))
        {
            problems.Add(new DossierProblem(DossierManifest.DossierFileName, "schemaVersion",
                $"is '{doc.SchemaVersion}'; this verifier reads '{DossierDocument.CurrentSchemaVersion}' (and '{DossierDocument.Version2SchemaVersion}', '{DossierDocument.LegacySchemaVersion}')."));
            return null;
        }

        return doc;
    }
}
