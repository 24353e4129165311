using EventReview.Core.Cases;
using EventReview.Core.Checklists;
using EventReview.Core.Network;
using EventReview.Core.Time;

namespace EventReview.Web.Api;

/// <summary>JSON shapes of the HTTP API (camelCase). GPS times are decimal seconds; UTC strings are ISO 8601.</summary>
public static class CaseDtos
{
    public sealed record CaseSummary(int Id, string CandidateId, decimal GpsTime, string Utc, string Search, string State, string? Outcome,
        double NetworkSnr, int SignedItems, int TotalItems, int StaleItems, string Coordinator, string Checklist, DateTimeOffset CreatedAt, DateTimeOffset UpdatedAt);

    public sealed record Arrival(string Site, decimal GpsTime, double Snr);

    public sealed record Item(string Key, string Section, string Title, string State, string? Owner, DateOnly? DueDate, string? CheckKind,
        int RequiredSignOffs, int CurrentSignOffs, bool StaleSignOffs, int EvidenceCount, string Fingerprint, int Version);

    public sealed record CaseDetail(int Id, string CandidateId, decimal GpsTime, string Utc, string Search, string Summary, string State, string? Outcome,
        double NetworkSnr, string Coordinator, string Checklist, DateTimeOffset CreatedAt, DateTimeOffset UpdatedAt, IReadOnlyList<Arrival> Arrivals, IReadOnlyList<Item> Items);

    public sealed record SiteDto(string Code, string Name, double LatitudeDegrees, double LongitudeDegrees, double HeightMeters,
        double XArmAzimuthDegrees, double YArmAzimuthDegrees, double TimingUncertaintySeconds);

    public static decimal Seconds(GpsTime t) => t.Nanoseconds / 1_000_000_000m;

    public static string Utc(GpsTime t) => GpsUtc.ToUtc(t).ToString(3);

    public static CaseSummary Summary(ReviewCase c) => new(c.Id, c.CandidateId, Seconds(c.Gps), Utc(c.Gps), c.Search, Api(c.State), c.Outcome?.ToString().ToLowerInvariant(),
        Math.Round(c.NetworkSnr, 2), c.SignedItemCount, c.Items.Count, c.StaleItemCount, c.CoordinatorName, c.ChecklistName, c.CreatedAt, c.UpdatedAt);

    public static CaseDetail Detail(ReviewCase c) => new(c.Id, c.CandidateId, Seconds(c.Gps), Utc(c.Gps), c.Search, c.Summary, Api(c.State), c.Outcome?.ToString().ToLowerInvariant(),
        Math.Round(c.NetworkSnr, 2), c.CoordinatorName, c.ChecklistName, c.CreatedAt, c.UpdatedAt,
        c.Arrivals.OrderBy(a => a.SiteCode).Select(a => new Arrival(a.SiteCode, Seconds(a.Arrival), a.Snr)).ToList(),
        c.Items.OrderBy(i => i.SectionOrder).ThenBy(i => i.Order).Select(i => new Item(i.Key, i.SectionKey, i.Title, Api(i.State), i.OwnerName, i.DueDate, i.CheckKind,
            i.RequiredSignOffs, i.CurrentSignOffs.Count(), i.HasStaleSignOffs, i.Evidence.Count + i.Computations.Count, i.Fingerprint(), i.Version)).ToList());

    /// <summary>One page of a list: how many match in all, where this page starts, its size limit, and the rows.</summary>
    public sealed record Page<T>(int Total, int Offset, int Limit, IReadOnlyList<T> Items);

    public sealed record Evidence(int Id, string Kind, string? Text, string? FileName, string? ContentType, long? SizeBytes, string? Url, string Sha256,
        string AddedBy, DateTimeOffset AddedAt, string? Download, string? Role);

    /// <summary>Answer to a new note: its evidence id, SHA-256, the item's state and new evidence fingerprint.</summary>
    public sealed record NoteAdded(int Id, string Sha256, string ItemState, string Fingerprint);

    /// <summary>Answer to a new file: its evidence id, SHA-256, size in bytes, cleaned file name and the item's new fingerprint.</summary>
    public sealed record FileAdded(int Id, string Sha256, long SizeBytes, string FileName, string Fingerprint, string? Role, string? RoleGuessedFrom);

    public sealed record TimelineEntry(int Sequence, DateTimeOffset At, string Actor, string Kind, string? ItemKey, string Text, string Hash);

    public static CaseDetail Detail(Services.CaseOverview o)
    {
        var c = o.Case;
        return new(c.Id, c.CandidateId, Seconds(c.Gps), Utc(c.Gps), c.Search, c.Summary, Api(c.State), c.Outcome?.ToString().ToLowerInvariant(),
            Math.Round(c.NetworkSnr, 2), c.CoordinatorName, c.ChecklistName, c.CreatedAt, c.UpdatedAt,
            c.Arrivals.OrderBy(a => a.SiteCode).Select(a => new Arrival(a.SiteCode, Seconds(a.Arrival), a.Snr)).ToList(),
            c.Items.OrderBy(i => i.SectionOrder).ThenBy(i => i.Order).Select(i => new Item(i.Key, i.SectionKey, i.Title, Api(i.State), i.OwnerName, i.DueDate, i.CheckKind,
                i.RequiredSignOffs, i.CurrentSignOffs.Count(), i.HasStaleSignOffs, o.Items[i.Key].EvidenceCount + o.Items[i.Key].ComputationCount, o.Items[i.Key].Fingerprint, i.Version)).ToList());
    }

    public static Evidence Of(EventReview.Core.Evidence.EvidenceItem e) => new(e.Id, EventReview.Core.Evidence.EvidenceFingerprint.KindName(e.Kind),
        e.Kind == EventReview.Core.Evidence.EvidenceKind.Note ? e.Text : NullIfEmpty(e.Text), e.FileName, e.ContentType, e.SizeBytes, e.Url, e.ContentSha256, e.AddedByName, e.AddedAt,
        e.Kind == EventReview.Core.Evidence.EvidenceKind.Attachment ? $"/files/{e.ContentSha256}?name={Uri.EscapeDataString(e.FileName ?? e.ContentSha256)}" : null, e.Role);

    public static TimelineEntry Of(EventReview.Core.Cases.TimelineEntry a) => new(a.Sequence, a.At, a.ActorName, a.Kind, a.ItemKey, a.Text, a.Hash);

    private static string? NullIfEmpty(string s) => string.IsNullOrEmpty(s) ? null : s;

    public static SiteDto Site(Site s) => new(s.Code, s.Name, s.LatitudeDegrees, s.LongitudeDegrees, s.HeightMeters, s.XArmAzimuthDegrees, s.YArmAzimuthDegrees, s.TimingUncertaintySeconds);

    /// <summary>API spelling of states: lower-case with dashes ("ready-for-sign-off", "awaiting-decision").</summary>
    public static string Api(ItemState s) => StateNames.Of(s).Replace(' ', '-');

    public static string Api(CaseState s) => StateNames.Of(s).Replace(' ', '-');
}
