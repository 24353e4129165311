using System.Globalization;
using EventReview.Core.Cases;

namespace EventReview.Core.Dossier;

/// <summary>
/// The timeline part of <see cref="DossierVerifier"/>: the hash chain recomputes entry by entry (the first entry that
/// does not match is named), and the chain head and head sequence of the dossier and of the manifest match the last entry.
/// </summary>
internal static class DossierTimelineCheck
{
    public static void Check(DossierDocument doc, DossierManifest? manifest, List<DossierProblem> problems)
    {
        const string d = DossierManifest.DossierFileName;
        var prev = TimelineEntry.GenesisHash;
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
                     !string.Equals(e.AtUtc, TimelineEntry.FormatUtc(new DateTimeOffset(e.AtUtcTicks, TimeSpan.Zero)), StringComparison.Ordinal))
            {
                what = "its time text and ticks disagree.";
            }
            else
            {
                var hash = TimelineEntry.ComputeHash(doc.Case.CandidateId, e.Sequence, new DateTimeOffset(e.AtUtcTicks, TimeSpan.Zero),
                    e.ActorId, e.ActorName, e.Kind, e.ItemKey, e.Text, e.Facts, e.PreviousHash);
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

        if (manifest?.HeadSequence is { } head && intact && head != expected - 1)
        {
            problems.Add(new DossierProblem(DossierManifest.FileName, "headSequence", string.Create(CultureInfo.InvariantCulture, $"is {head} but the timeline ends at entry {expected - 1}.")));
        }

        if (manifest is not null && !string.Equals(manifest.CandidateId, doc.Case.CandidateId, StringComparison.Ordinal))
        {
            problems.Add(new DossierProblem(DossierManifest.FileName, "candidateId", $"is '{manifest.CandidateId}' but dossier.json is about '{doc.Case.CandidateId}'."));
        }
    }

    private static string Short(string? hash) => hash is null ? "(none)" : hash.Length > 12 ? hash[..12] : hash;
}
