using EventReview.Core.Evidence;

namespace EventReview.Core.Cases;

/// <summary>
/// Verifies a stored case against its own record: the timeline hash chain; every note's text against its hash; every
/// attachment's bytes (through a callback); every evidence row, computation record and sign-off against the seal written
/// into the timeline when it was made; and every current sign-off against the item's evidence fingerprint now.
/// </summary>
public static class CaseIntegrity
{
    /// <summary>Returns every problem found (empty when the case verifies).</summary>
    /// <param name="c">The case with its items, evidence, computations, sign-offs and timeline loaded.</param>
    /// <param name="attachmentIntact">Given an attachment's SHA-256: true when the stored bytes hash to it, false when they do not or are missing.</param>
    public static IReadOnlyList<IntegrityProblem> Verify(ReviewCase c, Func<string, bool> attachmentIntact)
    {
        var problems = new List<IntegrityProblem>();
        var (entry, chain) = ActivityChain.Check(c.Activity);
        if (chain is not null)
        {
            problems.Add(new IntegrityProblem(c.CandidateId, entry, null, "Timeline: " + chain));
        }

        var textByItem = c.Activity.Where(a => a.ItemKey is not null).GroupBy(a => a.ItemKey!).ToDictionary(g => g.Key, g => string.Join('\n', g.Select(a => a.Text)));
        foreach (var item in c.Items)
        {
            var text = textByItem.GetValueOrDefault(item.Key, string.Empty);
            foreach (var e in item.Evidence)
            {
                var label = e.Kind == EvidenceKind.Attachment ? $"file '{e.FileName}'" : e.Kind.ToString().ToLowerInvariant();
                if (!e.NoteHashMatches())
                {
                    problems.Add(new IntegrityProblem(c.CandidateId, null, item.Key, $"The {label} added by {e.AddedByName} at {e.AddedAt.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC was altered: its text no longer matches its SHA-256 {e.ContentSha256[..12]}."));
                }

                if (!text.Contains($"Seal {e.Seal()}.", StringComparison.Ordinal))
                {
                    problems.Add(new IntegrityProblem(c.CandidateId, null, item.Key, $"The {label} added by {e.AddedByName} does not match the record made when it was added (row altered or inserted afterwards)."));
                }

                if (e.Kind == EvidenceKind.Attachment && !attachmentIntact(e.ContentSha256))
                {
                    problems.Add(new IntegrityProblem(c.CandidateId, null, item.Key, $"The stored bytes of {label} (sha256 {e.ContentSha256}) are missing or altered."));
                }
            }

            foreach (var r in item.Computations)
            {
                if (!text.Contains($"Seal {r.Seal()}.", StringComparison.Ordinal))
                {
                    problems.Add(new IntegrityProblem(c.CandidateId, null, item.Key, $"The '{r.Kind}' computation record run by {r.RunByName} at {r.RunAt.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC does not match the record made when it was run."));
                }
            }

            var fingerprint = item.Fingerprint();
            foreach (var s in item.SignOffs)
            {
                if (!text.Contains($"Seal {s.Seal()}.", StringComparison.Ordinal))
                {
                    problems.Add(new IntegrityProblem(c.CandidateId, null, item.Key, $"The sign-off by {s.SignerName} (recorded {s.SignedAtUtc.UtcDateTime:yyyy-MM-dd HH:mm:ss} UTC) does not match the record made when it was signed: its time, statement, meaning or fingerprint was changed."));
                }

                if (!s.IsStale && s.EvidenceFingerprint != fingerprint)
                {
                    problems.Add(new IntegrityProblem(c.CandidateId, null, item.Key, $"The current sign-off by {s.SignerName} was given against evidence {s.EvidenceFingerprint[..12]} but the item's evidence is now {fingerprint[..12]}, and no stale mark was recorded."));
                }
            }
        }

        return problems;
    }
}
