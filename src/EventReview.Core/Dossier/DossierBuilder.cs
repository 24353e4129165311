using System.Globalization;
using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;
using EventReview.Core.Network;

namespace EventReview.Core.Dossier;

/// <summary>
/// Builds the <see cref="DossierDocument"/> of a case. Deterministic: no clock, no randomness; every list is ordered
/// (items by section and position, evidence by time then id, sign-offs by time then id, snapshots by site, capture
/// time and id, timeline by sequence), so building an unchanged case twice gives equal documents.
/// </summary>
public static class DossierBuilder
{
    /// <summary>Generator name written into every dossier.</summary>
    public const string GeneratorName = "EventReview";

    /// <summary>Separator between SVG pictures in <see cref="ComputationRecord.PicturesSvg"/>.</summary>
    public const string PictureSeparator = "<!--next-->";

    /// <summary>Generator version: the Core assembly's version (major.minor.patch).</summary>
    public static string GeneratorVersion { get; } = typeof(DossierBuilder).Assembly.GetName().Version?.ToString(3) ?? "0.0.0";

    /// <summary>
    /// Builds the document. <paramref name="sites"/> may hold the whole network: only sites named by an arrival or a
    /// snapshot are kept. <paramref name="snapshots"/> are the configuration snapshots to include (normally those of
    /// the case and later ones of its sites); each unfrozen one is checked for drift against the newest frozen snapshot
    /// of its site captured before it.
    /// </summary>
    public static DossierDocument Build(ReviewCase reviewCase, IReadOnlyList<Site> sites, IReadOnlyList<ConfigurationSnapshot> snapshots)
    {
        ArgumentNullException.ThrowIfNull(reviewCase);
        ArgumentNullException.ThrowIfNull(sites);
        ArgumentNullException.ThrowIfNull(snapshots);
        var c = reviewCase;
        var pictures = new SortedDictionary<string, string>(StringComparer.Ordinal);
        var items = c.Items.OrderBy(i => i.SectionOrder).ThenBy(i => i.Order).ThenBy(i => i.Key, StringComparer.Ordinal)
            .Select(i => Item(i, pictures)).ToList();
        var used = c.Arrivals.Select(a => a.SiteCode).Concat(snapshots.Select(s => s.SiteCode)).ToHashSet(StringComparer.Ordinal);
        var timeline = c.Timeline.OrderBy(a => a.Sequence).Select(a => new DossierTimelineEntry(
            a.Sequence, TimelineEntry.FormatUtc(a.At), a.At.UtcTicks, a.ActorId, a.ActorName, a.Kind, a.ItemKey, a.Text, a.PreviousHash, a.Hash,
            a.Facts, a.KeyId, a.Mac)).ToList();
        return new DossierDocument(
            DossierDocument.CurrentSchemaVersion,
            new DossierGenerator(GeneratorName, GeneratorVersion),
            Summary(c),
            c.Arrivals.OrderBy(a => a.SiteCode, StringComparer.Ordinal)
                .Select(a => new DossierArrival(a.SiteCode, a.ArrivalNanoseconds, a.Arrival.ToString(), a.Snr)).ToList(),
            sites.Where(s => used.Contains(s.Code)).OrderBy(s => s.Code, StringComparer.Ordinal)
                .Select(s => new DossierSite(s.Code, s.Name, s.LatitudeDegrees, s.LongitudeDegrees, s.HeightMeters, s.XArmAzimuthDegrees, s.YArmAzimuthDegrees, s.TimingUncertaintySeconds))
                .ToList(),
            items,
            Configurations(snapshots, c.Id),
            timeline,
            timeline.Count == 0 ? TimelineEntry.GenesisHash : timeline[^1].Hash)
        {
            PictureSvgs = pictures,
        };
    }

    private static DossierCase Summary(ReviewCase c) => new(
        c.CandidateId, c.GpsNanoseconds, c.Gps.ToString(), c.Search, c.Summary, StateNames.Of(c.State),
        c.Outcome is { } o ? StateNames.Of(o) : null, c.ClosingStatement, c.CoordinatorId, c.CoordinatorName,
        c.ChecklistName, c.ChecklistVersion, Utc(c.CreatedAt), c.CreatedAt.UtcTicks, Utc(c.UpdatedAt), c.UpdatedAt.UtcTicks,
        c.NetworkSnr, c.Items.Count, c.SignedItemCount, c.StaleItemCount);

    private static DossierItem Item(ChecklistItem i, SortedDictionary<string, string> pictures)
    {
        var evidence = i.Evidence.OrderBy(e => e.AddedAt).ThenBy(e => e.Id).Select(e => new DossierEvidence(
            e.Id, EvidenceFingerprint.KindName(e.Kind), e.Text, e.FileName, e.ContentType, e.SizeBytes, e.Url, e.ContentSha256,
            e.Kind == EvidenceKind.Attachment ? AttachmentNames.PathOf(e.ContentSha256, e.FileName) : null,
            e.AddedBy, e.AddedByName, Utc(e.AddedAt), e.AddedAt.UtcTicks, e.Role)).ToList();
        var computations = new List<DossierComputation>();
        foreach (var r in i.Computations.OrderBy(r => r.RunAt).ThenBy(r => r.Id))
        {
            var names = new List<string>();
            foreach (var svg in r.PicturesSvg.Split(PictureSeparator).Select(p => p.Trim()).Where(p => p.Length > 0))
            {
                var name = string.Create(CultureInfo.InvariantCulture, $"pictures/{pictures.Count + 1}.svg");
                pictures[name] = svg;
                names.Add(name);
            }

            computations.Add(new DossierComputation(r.Id, r.Kind, r.ParametersJson, r.InputFingerprint, r.ToolVersion, r.ResultJson,
                r.Verdict, r.Summary, r.ContentSha256, r.RunBy, r.RunByName, Utc(r.RunAt), r.RunAt.UtcTicks, names, Hashing.Sha256Hex(r.PicturesSvg)));
        }

        var signOffs = i.SignOffs.OrderBy(s => s.SignedAtUtc).ThenBy(s => s.Id).Select(s => new DossierSignOff(
            s.Id, s.UserId, s.SignerName, s.Meaning.ToString().ToLowerInvariant(), s.Statement, Utc(s.SignedAtUtc), s.SignedAtUtc.UtcTicks,
            s.SignedAtGpsNanoseconds, s.SignedAtGps.ToString(), s.EvidenceFingerprint, s.IsStale,
            s.StaleSince is { } since ? Utc(since) : null, s.StaleSince?.UtcTicks)).ToList();
        return new DossierItem(i.Key, i.SectionKey, i.SectionTitle, i.SectionOrder, i.Order, i.Title, i.Guidance, i.CheckKind,
            i.OwnerId, i.OwnerName, i.DueDate?.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture), StateNames.Of(i.State),
            i.RequiredSignOffs, i.OwnerMaySign, i.HasStaleSignOffs, i.LatestComputation?.Verdict,
            evidence, computations, signOffs, null, i.Fingerprint());
    }

    private static List<DossierConfiguration> Configurations(IReadOnlyList<ConfigurationSnapshot> snapshots, int caseId)
    {
        var ordered = snapshots.OrderBy(s => s.SiteCode, StringComparer.Ordinal).ThenBy(s => s.CapturedAt).ThenBy(s => s.Id).ToList();
        var result = new List<DossierConfiguration>(ordered.Count);
        foreach (var s in ordered)
        {
            DossierDrift? drift = null;
            if (!s.IsFrozen)
            {
                var frozen = ordered.Where(f => f.IsFrozen && f.SiteCode == s.SiteCode && f.CapturedAt <= s.CapturedAt && !ReferenceEquals(f, s))
                    .OrderBy(f => f.CapturedAt).ThenBy(f => f.Id).LastOrDefault();
                if (frozen is not null)
                {
                    var r = DriftCheck.Run(frozen, s);
                    drift = new DossierDrift(frozen.Id, r.Verdict, r.Summary, r.CapturedDuringFreeze == true, r.Diff.Added, r.Diff.Removed, r.Diff.Changed, r.Diff.Unchanged);
                }
            }

            result.Add(new DossierConfiguration(s.Id, s.SiteCode, s.Label, s.CapturedBy, s.CapturedByName, Utc(s.CapturedAt), s.CapturedAt.UtcTicks,
                s.IsFrozen, s.FrozenBy, s.FrozenByName, s.FrozenAt is { } fa ? Utc(fa) : null,
                s.FreezeFrom is { } ff ? Utc(ff) : null, s.FreezeFrom?.UtcTicks,
                s.FreezeUntil is { } fu ? Utc(fu) : null, s.FreezeUntil?.UtcTicks,
                s.FreezeReason, s.Fingerprint,
                s.Items.OrderBy(kv => kv.Key, StringComparer.Ordinal).Select(kv => new ConfigurationEntry(kv.Key, kv.Value)).ToList(),
                drift, s.FrozenAt?.UtcTicks, s.ReviewCaseId == caseId));
        }

        return result;
    }

    /// <summary>ISO 8601 UTC with 7 fractional digits and 'Z' (the form every dossier time uses).</summary>
    public static string Utc(DateTimeOffset at) => TimelineEntry.FormatUtc(at);
}
