using System.Globalization;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;

namespace EventReview.Core.Dossier;

/// <summary>
/// The content part of <see cref="DossierVerifier"/>: every note, link and computation record hashes to its stored content
/// hash, every attachment is present with that hash and size, every picture is present, every item's evidence fingerprint
/// recomputes, every current sign-off was given against it, and every frozen configuration's fingerprint recomputes.
/// </summary>
internal static class DossierContentCheck
{
    public static void CheckItem(string schemaVersion, DossierItem item, IReadOnlyDictionary<string, byte[]> files, List<DossierProblem> problems)
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
                "attachment" => CheckAttachment(schemaVersion, e, ewhere, files, problems),
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

    private static string? CheckAttachment(string schemaVersion, DossierEvidence e, string where, IReadOnlyDictionary<string, byte[]> files, List<DossierProblem> problems)
    {
        var path = DossierDocument.AttachmentPath(schemaVersion, e.ContentSha256, e.FileName);
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

    public static void CheckConfigurations(DossierDocument doc, List<DossierProblem> problems)
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
