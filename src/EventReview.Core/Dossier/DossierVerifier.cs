using System.Globalization;
using System.Text.Json;
using EventReview.Core.Cases;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;

namespace EventReview.Core.Dossier;

/// <summary>
/// Verifies an exported dossier offline, from the files of its ZIP (path to bytes), without the database:
/// <list type="number">
/// <item><c>manifest.json</c> lists every other file exactly once, no listed file is missing, no file is unlisted, and
/// each file's SHA-256 and size match;</item>
/// <item><c>dossier.json</c> has schema version <see cref="DossierDocument.CurrentSchemaVersion"/>;</item>
/// <item>the timeline's hash chain recomputes entry by entry (the first entry that does not match is named), and the
/// chain head of the dossier and of the manifest equal the last entry's hash;</item>
/// <item>every note, link and computation record hashes to its stored content hash, every attachment is present under
/// <c>attachments/&lt;sha256&gt;</c> with that hash and size, every picture is present, and every item's evidence
/// fingerprint recomputes from them;</item>
/// <item>every sign-off that is not stale was given against the item's current fingerprint;</item>
/// <item>every frozen configuration snapshot's fingerprint recomputes from its items.</item>
/// </list>
/// Never throws for bad content: everything wrong becomes a <see cref="DossierProblem"/>.
/// </summary>
public static class DossierVerifier
{
    /// <summary>Verifies the dossier's files (paths '/' separated, as in the ZIP).</summary>
    public static DossierVerification Verify(IReadOnlyDictionary<string, byte[]> files)
    {
        ArgumentNullException.ThrowIfNull(files);
        var problems = new List<DossierProblem>();
        var manifest = CheckManifest(files, problems);
        if (!files.TryGetValue(DossierManifest.DossierFileName, out var dossierBytes))
        {
            problems.Add(new DossierProblem(DossierManifest.DossierFileName, null, "missing from the ZIP."));
            return DossierVerification.Of(problems);
        }

        DossierDocument doc;
        try
        {
            doc = DossierJson.Deserialize<DossierDocument>(dossierBytes);
        }
        catch (JsonException ex)
        {
            problems.Add(new DossierProblem(DossierManifest.DossierFileName, ex.Path, "not a valid dossier document: " + ex.Message));
            return DossierVerification.Of(problems);
        }

        if (doc.SchemaVersion != DossierDocument.CurrentSchemaVersion)
        {
            problems.Add(new DossierProblem(DossierManifest.DossierFileName, "schemaVersion",
                $"is '{doc.SchemaVersion}'; this verifier reads '{DossierDocument.CurrentSchemaVersion}'."));
            return DossierVerification.Of(problems);
        }

        try
        {
            CheckTimeline(doc, manifest, problems);
            foreach (var item in doc.Items)
            {
                CheckItem(item, files, problems);
            }

            CheckConfigurations(doc, problems);
        }
        catch (Exception ex) when (ex is NullReferenceException or ArgumentException or FormatException or InvalidOperationException or OverflowException)
        {
            problems.Add(new DossierProblem(DossierManifest.DossierFileName, null, "could not be checked: " + ex.Message));
        }

        return DossierVerification.Of(problems);
    }

    private static DossierManifest? CheckManifest(IReadOnlyDictionary<string, byte[]> files, List<DossierProblem> problems)
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

        if (manifest.SchemaVersion != DossierDocument.CurrentSchemaVersion)
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

    private static void CheckTimeline(DossierDocument doc, DossierManifest? manifest, List<DossierProblem> problems)
    {
        const string d = DossierManifest.DossierFileName;
        var prev = ActivityEntry.GenesisHash;
        var expected = 1;
        var intact = true;
        foreach (var e in doc.Timeline)
        {
            var where = string.Create(CultureInfo.InvariantCulture, $"timeline entry {e.Sequence} ({e.Kind}, {e.AtUtc} by {e.ActorName})");
            string? what = null;
            if (e.Sequence != expected)
            {
                what = string.Create(CultureInfo.InvariantCulture, $"expected entry {expected} here: an entry is missing or out of order.");
            }
            else if (!string.Equals(e.PreviousHash, prev, StringComparison.Ordinal))
            {
                what = $"does not link to the entry before it: previous hash {Short(e.PreviousHash)} should be {Short(prev)}.";
            }
            else if (e.AtUtcTicks is < 0 || e.AtUtcTicks > DateTime.MaxValue.Ticks ||
                     !string.Equals(e.AtUtc, ActivityEntry.FormatUtc(new DateTimeOffset(e.AtUtcTicks, TimeSpan.Zero)), StringComparison.Ordinal))
            {
                what = "its time text and ticks disagree.";
            }
            else
            {
                var hash = ActivityEntry.ComputeHash(doc.Case.CandidateId, e.Sequence, new DateTimeOffset(e.AtUtcTicks, TimeSpan.Zero),
                    e.ActorId, e.ActorName, e.Kind, e.ItemKey, e.Text, e.PreviousHash);
                if (!string.Equals(hash, e.Hash, StringComparison.Ordinal))
                {
                    what = $"was altered: its content hashes to {Short(hash)} but the entry says {Short(e.Hash)}.";
                }
            }

            if (what is not null)
            {
                problems.Add(new DossierProblem(d, where, what));
                intact = false;
                break;
            }

            prev = e.Hash;
            expected++;
        }

        if (intact && !string.Equals(doc.ChainHead, prev, StringComparison.Ordinal))
        {
            problems.Add(new DossierProblem(d, "chainHead", $"is {Short(doc.ChainHead)} but the last timeline entry's hash is {Short(prev)} (entries were removed or added)."));
        }

        if (manifest is not null && !string.Equals(manifest.ChainHead, doc.ChainHead, StringComparison.Ordinal))
        {
            problems.Add(new DossierProblem(DossierManifest.FileName, "chainHead", $"is {Short(manifest.ChainHead)} but dossier.json's chain head is {Short(doc.ChainHead)}."));
        }

        if (manifest is not null && !string.Equals(manifest.CandidateId, doc.Case.CandidateId, StringComparison.Ordinal))
        {
            problems.Add(new DossierProblem(DossierManifest.FileName, "candidateId", $"is '{manifest.CandidateId}' but dossier.json is about '{doc.Case.CandidateId}'."));
        }
    }

    private static void CheckItem(DossierItem item, IReadOnlyDictionary<string, byte[]> files, List<DossierProblem> problems)
    {
        const string d = DossierManifest.DossierFileName;
        var where = $"item {item.Key}";
        var lines = new List<EvidenceLine>();
        foreach (var e in item.Evidence)
        {
            var ewhere = string.Create(CultureInfo.InvariantCulture, $"{where}, {e.Kind} {e.Id} added {e.AddedAtUtc} by {e.AddedByName}");
            var sha = e.Kind switch
            {
                "note" => Hashing.Sha256Hex(e.Text),
                "link" => Hashing.Sha256Hex(e.Url ?? string.Empty),
                "attachment" => CheckAttachment(e, ewhere, files, problems),
                _ => null,
            };
            if (sha is null)
            {
                problems.Add(new DossierProblem(d, ewhere, $"unknown evidence kind '{e.Kind}'."));
                continue;
            }

            if (!string.Equals(sha, e.ContentSha256, StringComparison.Ordinal))
            {
                problems.Add(new DossierProblem(d, ewhere, $"content hashes to {Short(sha)} but the record says {Short(e.ContentSha256)} (the {e.Kind} was altered)."));
            }

            lines.Add(new EvidenceLine(e.Kind, sha, e.AddedAtUtcTicks));
        }

        var computations = new List<ComputationLine>();
        foreach (var c in item.Computations)
        {
            var cwhere = string.Create(CultureInfo.InvariantCulture, $"{where}, computation {c.Id} ({c.Kind}, run {c.RunAtUtc})");
            var sha = ComputationRecord.ComputeContentSha256(c.Kind, c.ParametersJson, c.InputFingerprint, c.ToolVersion, c.ResultJson, c.Verdict);
            if (!string.Equals(sha, c.ContentSha256, StringComparison.Ordinal))
            {
                problems.Add(new DossierProblem(d, cwhere, $"parameters, inputs, result or verdict hash to {Short(sha)} but the record says {Short(c.ContentSha256)} (altered)."));
            }

            foreach (var p in c.Pictures.Where(p => !files.ContainsKey(p)))
            {
                problems.Add(new DossierProblem(p, cwhere, "picture named by the computation record is missing from the ZIP."));
            }

            computations.Add(new ComputationLine(sha, c.RunAtUtcTicks));
        }

        var fingerprint = EvidenceFingerprint.Compute(lines, computations, item.ConfigurationFingerprint);
        if (!string.Equals(fingerprint, item.Fingerprint, StringComparison.Ordinal))
        {
            problems.Add(new DossierProblem(d, where, $"evidence fingerprint recomputed from its evidence is {Short(fingerprint)} but the dossier says {Short(item.Fingerprint)}."));
        }

        foreach (var s in item.SignOffs.Where(s => !s.IsStale))
        {
            if (!string.Equals(s.EvidenceFingerprint, fingerprint, StringComparison.Ordinal))
            {
                problems.Add(new DossierProblem(d, string.Create(CultureInfo.InvariantCulture, $"{where}, sign-off {s.Id} by {s.SignerName} at {s.SignedAtUtc}"),
                    $"is marked current but was given against evidence {Short(s.EvidenceFingerprint)}, not the item's evidence {Short(fingerprint)}."));
            }
        }
    }

    private static string? CheckAttachment(DossierEvidence e, string where, IReadOnlyDictionary<string, byte[]> files, List<DossierProblem> problems)
    {
        var path = DossierBuilder.AttachmentPath(e.ContentSha256);
        if (!string.Equals(e.AttachmentPath, path, StringComparison.Ordinal))
        {
            problems.Add(new DossierProblem(DossierManifest.DossierFileName, where, $"attachment path is '{e.AttachmentPath}'; expected '{path}'."));
        }

        if (!files.TryGetValue(path, out var bytes))
        {
            problems.Add(new DossierProblem(path, where, $"attachment '{e.FileName}' is missing from the ZIP."));
            return e.ContentSha256;
        }

        if (e.SizeBytes is { } size && size != bytes.LongLength)
        {
            problems.Add(new DossierProblem(path, where, $"attachment '{e.FileName}' is {bytes.LongLength} bytes; the record says {size}."));
        }

        return Hashing.Sha256Hex(bytes);
    }

    private static void CheckConfigurations(DossierDocument doc, List<DossierProblem> problems)
    {
        const string d = DossierManifest.DossierFileName;
        foreach (var s in doc.Configurations)
        {
            var where = string.Create(CultureInfo.InvariantCulture, $"configuration {s.Id} of {s.SiteCode} ('{s.Label}', captured {s.CapturedAtUtc})");
            var items = new Dictionary<string, string>(StringComparer.Ordinal);
            foreach (var entry in s.Items)
            {
                if (!items.TryAdd(entry.Key, entry.Value))
                {
                    problems.Add(new DossierProblem(d, where, $"item '{entry.Key}' appears twice."));
                }
            }

            if (!s.IsFrozen)
            {
                continue;
            }

            if (s.FreezeFromUtcTicks is not { } from || s.FreezeUntilUtcTicks is not { } until || s.FreezeReason is null || s.Fingerprint is null)
            {
                problems.Add(new DossierProblem(d, where, "is frozen but lacks its freeze period, reason or fingerprint."));
                continue;
            }

            var fp = ConfigurationCanonical.Fingerprint(s.SiteCode, s.Label, new DateTimeOffset(from, TimeSpan.Zero), new DateTimeOffset(until, TimeSpan.Zero), s.FreezeReason, items);
            if (!string.Equals(fp, s.Fingerprint, StringComparison.Ordinal))
            {
                problems.Add(new DossierProblem(d, where, $"frozen configuration recomputes to fingerprint {Short(fp)} but was frozen as {Short(s.Fingerprint)} (an item, the period or the reason was altered)."));
            }
        }
    }

    private static string Short(string? hash) => hash is null ? "(none)" : hash.Length > 12 ? hash[..12] : hash;
}
