using EventReview.Core.Configuration;
using EventReview.Core.Evidence;
using EventReview.Core.Records;

namespace EventReview.Core.Cases;

/// <summary>
/// Verifies a stored case against its own signed record: the timeline hash chain; every entry's MAC under the record key
/// (so the chain cannot have been recomputed without the key); the stored case recomputed from the facts of its timeline
/// (<see cref="CaseReplay"/>, <see cref="CaseRecordCheck"/>: case state, outcome, times, arrivals, items, every evidence,
/// computation and sign-off row with its stale mark, frozen configuration records; missing and unaccounted rows); every
/// note's text against its hash; every attachment's bytes (through a callback); and every current sign-off against the
/// item's evidence fingerprint now. Never throws for bad content.
/// </summary>
public static class CaseIntegrity
{
    /// <summary>Returns every problem found (empty when the case verifies).</summary>
    /// <param name="c">The case with its items, evidence, computations, sign-offs and timeline loaded.</param>
    /// <param name="attachmentIntact">Given an attachment's SHA-256: true when the stored bytes hash to it, false when they do not or are missing.</param>
    /// <param name="keys">The record keys (their MAC keys check every entry).</param>
    /// <param name="configurations">The configuration records stored for this case (frozen or not); null to leave them out.</param>
    public static IReadOnlyList<IntegrityProblem> Verify(ReviewCase c, Func<string, bool> attachmentIntact, IRecordKeyRing keys,
        IEnumerable<ConfigurationSnapshot>? configurations = null)
    {
        ArgumentNullException.ThrowIfNull(c);
        ArgumentNullException.ThrowIfNull(keys);
        var problems = new List<IntegrityProblem>();
        var (entry, chain) = TimelineChain.Check(c.Timeline);
        if (chain is not null)
        {
            problems.Add(new IntegrityProblem(c.CandidateId, entry, null, "Timeline: " + chain));
        }

        if (Signatures(c, keys) is { } signature)
        {
            problems.Add(signature);
        }

        var recorded = CaseReplay.Replay(c.Timeline.Select(a => new CaseReplay.Entry(a.Sequence, a.Kind, a.ActorName, a.At.UtcTicks, a.Facts)));
        if (recorded.WithoutFacts.Count > 0)
        {
            problems.Add(new IntegrityProblem(c.CandidateId, recorded.WithoutFacts[0], null,
                $"Timeline: {recorded.WithoutFacts.Count} entr{(recorded.WithoutFacts.Count == 1 ? "y" : "ies")} (first: {recorded.WithoutFacts[0]}) carry no facts, so the stored case cannot be recomputed from its timeline."));
        }
        else
        {
            problems.AddRange(CaseRecordCheck.Compare(c.CandidateId, recorded, StoredCase.Of(c, configurations?.Where(s => s.ReviewCaseId == c.Id))));
        }

        foreach (var item in c.Items)
        {
            foreach (var e in item.Evidence)
            {
                var label = e.Kind == EvidenceKind.Attachment ? $"file '{e.FileName}'" : e.Kind.ToString().ToLowerInvariant();
                if (!e.NoteHashMatches())
                {
                    problems.Add(new IntegrityProblem(c.CandidateId, null, item.Key, $"The {label} added by {e.AddedByName} at {e.AddedAt.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC was altered: its text no longer matches its SHA-256 {Short(e.ContentSha256)}."));
                }

                if (e.Kind == EvidenceKind.Attachment && (!Hashing.IsSha256Hex(e.ContentSha256) || !attachmentIntact(e.ContentSha256)))
                {
                    problems.Add(new IntegrityProblem(c.CandidateId, null, item.Key, $"The stored bytes of {label} (sha256 {e.ContentSha256}) are missing or altered."));
                }
            }

            var fingerprint = item.Fingerprint();
            foreach (var s in item.SignOffs.Where(s => !s.IsStale && s.EvidenceFingerprint != fingerprint))
            {
                problems.Add(new IntegrityProblem(c.CandidateId, null, item.Key, $"The current sign-off by {s.SignerName} was given against evidence {Short(s.EvidenceFingerprint)} but the item's evidence is now {Short(fingerprint)}, and no stale mark was recorded."));
            }
        }

        return problems;
    }

    /// <summary>The first entry whose MAC is missing, from an unknown key or wrong (with how many more follow), or null.</summary>
    private static IntegrityProblem? Signatures(ReviewCase c, IRecordKeyRing keys)
    {
        IntegrityProblem? first = null;
        var more = 0;
        foreach (var a in c.Timeline.OrderBy(a => a.Sequence))
        {
            var ok = a.MacMatches(keys);
            if (ok == true)
            {
                continue;
            }

            if (first is not null)
            {
                more++;
                continue;
            }

            var who = $"entry {a.Sequence} ({a.Kind}, {a.At.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC by {a.ActorName})";
            first = new IntegrityProblem(c.CandidateId, a.Sequence, null, "Timeline: " + (a.KeyId is null || a.Mac is null
                ? $"{who} carries no signature: it was not written by this server with its record key (inserted, or its signature removed)"
                : ok is null
                    ? $"{who} is signed with key {Short(a.KeyId)}, which is not in the key ring: its signature cannot be checked (give the key folder that holds it)"
                    : $"{who} does not match its signature: it was altered, and perhaps re-hashed, without the record key"));
        }

        return first is null ? null : first with { What = first.What + (more == 0 ? "." : $" ({more} later entr{(more == 1 ? "y" : "ies")} fail too).") };
    }

    private static string Short(string? hash) => hash is null ? "(none)" : hash.Length > 12 ? hash[..12] : hash;
}
