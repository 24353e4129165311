using System.Globalization;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;
using EventReview.Core.Records;

namespace EventReview.Core.Dossier;

/// <summary>
/// The record part of <see cref="DossierVerifier"/>: replays the facts of the dossier's timeline (<see cref="CaseReplay"/>)
/// and compares the dossier's case, arrivals, items, evidence, computation records, sign-offs with their stale marks and
/// frozen configurations with what they say (<see cref="CaseRecordCheck"/>), so that <c>dossier.json</c> cannot show an
/// outcome, a signer or a statement its own signed timeline does not; and recomputes the totals the readable files show.
/// </summary>
internal static class DossierRecordCheck
{
    public static void Check(DossierDocument doc, List<DossierProblem> problems)
    {
        const string d = DossierManifest.DossierFileName;
        var recorded = CaseReplay.Replay(doc.Timeline.Select(e => new CaseReplay.Entry(e.Sequence, e.Kind, e.ActorName, e.AtUtcTicks, e.Facts)));
        if (recorded.WithoutFacts.Count > 0)
        {
            if (doc.SchemaVersion != DossierDocument.LegacySchemaVersion)
            {
                problems.Add(new DossierProblem(d, string.Create(CultureInfo.InvariantCulture, $"timeline entry {recorded.WithoutFacts[0]}"), "carries no facts, so the dossier's contents cannot be checked against its timeline."));
            }
        }
        else
        {
            foreach (var p in CaseRecordCheck.Compare(doc.Case.CandidateId, recorded, Stored(doc)))
            {
                var where = p.Item is not null ? $"item {p.Item}" : p.Entry is { } n ? string.Create(CultureInfo.InvariantCulture, $"timeline entry {n}") : "case";
                problems.Add(new DossierProblem(d, where, p.What.Replace("the database", "the dossier", StringComparison.Ordinal)));
            }
        }

        Totals(doc, problems);
    }

    /// <summary>The dossier's contents in the terms of <see cref="StoredCase"/>.</summary>
    private static StoredCase Stored(DossierDocument doc)
    {
        var c = doc.Case;
        var fields = StoredCase.ToDictionary(CaseFacts.CaseFields(c.CandidateId, c.GpsNanoseconds, c.Search, c.Summary, c.CoordinatorId, c.CoordinatorName,
            c.ChecklistName, c.ChecklistVersion, c.CreatedAtUtcTicks, CaseState.Open, null, c.ClosingStatement));
        fields[FactNames.Case(FactNames.State)] = StateNames.TryParse(c.State, out CaseState cs) ? cs.ToString() : c.State;
        fields[FactNames.Case(FactNames.Outcome)] = c.Outcome is null ? string.Empty : StateNames.TryParse(c.Outcome, out CaseOutcome o) ? o.ToString() : c.Outcome;
        foreach (var a in doc.Arrivals)
        {
            var f = CaseFacts.Arrival(a.SiteCode, a.ArrivalGpsNanoseconds, a.Snr);
            fields[f.Name] = f.Value;
        }

        var rows = new List<StoredRow>();
        foreach (var i in doc.Items)
        {
            DateOnly? due = DateOnly.TryParseExact(i.DueDate, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out var day) ? day : null;
            foreach (var f in CaseFacts.ItemFields(i.Key, i.SectionKey, i.SectionTitle, i.SectionOrder, i.Order, i.Title, i.Guidance, i.CheckKind,
                i.RequiredSignOffs, i.OwnerMaySign, due, i.OwnerId, i.OwnerName, ItemState.Open))
            {
                fields[f.Name] = f.Value;
            }

            fields[FactNames.Item(i.Key, FactNames.State)] = StateNames.TryParse(i.State, out ItemState s) ? s.ToString() : i.State;
            if (i.DueDate is not null && due is null)
            {
                fields[FactNames.Item(i.Key, FactNames.Due)] = i.DueDate;
            }

            rows.AddRange(i.Evidence.Select(e => new StoredRow("evidence", i.Key,
                EvidenceItem.ComputeSeal(Member(e.Kind), e.ContentSha256, e.FileName, e.SizeBytes, e.Url, e.AddedBy, e.AddedByName, e.AddedAtUtcTicks, e.Role),
                EvidenceItem.ComputeDetailSha256(e.Text, e.ContentType), false, null, $"{e.Kind} {e.Id} added by {e.AddedByName} at {e.AddedAtUtc}")));
            rows.AddRange(i.Computations.Select(r => new StoredRow("computation", i.Key,
                ComputationRecord.ComputeSeal(ComputationRecord.ComputeContentSha256(r.Kind, r.ParametersJson, r.InputFingerprint, r.ToolVersion, r.ResultJson, r.Verdict),
                    r.PicturesSha256 ?? string.Empty, r.Summary, r.RunBy, r.RunByName, r.RunAtUtcTicks),
                string.Empty, false, null, $"'{r.Kind}' computation record {r.Id} run by {r.RunByName} at {r.RunAtUtc}")));
            rows.AddRange(i.SignOffs.Select(s => new StoredRow("signoff", i.Key,
                SignOff.ComputeSeal(s.UserId, s.SignerName, s.SignedAtUtcTicks, s.SignedAtGpsNanoseconds, Member(s.Meaning), s.Statement, s.EvidenceFingerprint),
                string.Empty, s.IsStale, s.StaleSinceUtcTicks, $"sign-off {s.Id} by {s.SignerName} (signed {s.SignedAtUtc})")));
        }

        return new StoredCase
        {
            Fields = fields,
            Rows = rows,
            Configurations = doc.Configurations.Where(s => s.OfThisCase).Select(Configuration).ToList(),
            UpdatedAtUtcTicks = c.UpdatedAtUtcTicks,
        };
    }

    private static StoredConfiguration Configuration(DossierConfiguration s)
    {
        string? recomputed = null;
        if (s.IsFrozen && s.FreezeFromUtcTicks is { } from && s.FreezeUntilUtcTicks is { } until && s.FreezeReason is not null)
        {
            var items = new Dictionary<string, string>(StringComparer.Ordinal);
            foreach (var e in s.Items)
            {
                items.TryAdd(e.Key, e.Value);
            }

            recomputed = ConfigurationCanonical.Fingerprint(s.SiteCode, s.Label, new DateTimeOffset(from, TimeSpan.Zero), new DateTimeOffset(until, TimeSpan.Zero), s.FreezeReason, items);
        }

        return new StoredConfiguration(s.Id.ToString(CultureInfo.InvariantCulture), s.SiteCode, s.IsFrozen, s.Fingerprint, recomputed,
            CaseFacts.ConfigurationDetail(s.SiteCode, s.CapturedBy, s.CapturedByName, s.CapturedAtUtcTicks, s.FrozenBy ?? string.Empty, s.FrozenByName ?? string.Empty, s.FrozenAtUtcTicks ?? 0));
    }

    /// <summary>The totals and per-item summaries that index.html and summary.pdf show, recomputed from the dossier's own rows.</summary>
    private static void Totals(DossierDocument doc, List<DossierProblem> problems)
    {
        const string d = DossierManifest.DossierFileName;
        void Expect<T>(string where, string field, T shown, T actual)
        {
            if (!EqualityComparer<T>.Default.Equals(shown, actual))
            {
                problems.Add(new DossierProblem(d, where, $"{field} is {shown} but its own rows give {actual}."));
            }
        }

        var c = doc.Case;
        Expect("case", "itemCount", c.ItemCount, doc.Items.Count);
        Expect("case", "signedItemCount", c.SignedItemCount, doc.Items.Count(i => i.State == StateNames.Of(ItemState.SignedOff)));
        Expect("case", "staleItemCount", c.StaleItemCount, doc.Items.Count(i => i.HasStaleSignOffs));
        var snr = Math.Sqrt(doc.Arrivals.Sum(a => a.Snr * a.Snr));
        if (!(Math.Abs(c.NetworkSnr - snr) <= 1e-9 * Math.Max(1.0, snr)))
        {
            problems.Add(new DossierProblem(d, "case", string.Create(CultureInfo.InvariantCulture, $"networkSnr is {c.NetworkSnr} but its arrivals give {snr}.")));
        }

        foreach (var i in doc.Items)
        {
            Expect($"item {i.Key}", "hasStaleSignOffs", i.HasStaleSignOffs, i.SignOffs.Any(s => s.IsStale) && i.State != StateNames.Of(ItemState.SignedOff));
            var latest = i.Computations.OrderBy(r => r.RunAtUtcTicks).ThenBy(r => r.Id).LastOrDefault()?.Verdict;
            Expect($"item {i.Key}", "latestVerdict", i.LatestVerdict ?? "(none)", latest ?? "(none)");
        }
    }

    /// <summary>A lower-case kind or meaning word as its member name ("note" to "Note").</summary>
    private static string Member(string word) => word.Length == 0 ? word : char.ToUpperInvariant(word[0]) + word[1..];
}
