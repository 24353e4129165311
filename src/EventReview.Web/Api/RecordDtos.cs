using System.Text.Json;
using EventReview.Core.Evidence;

namespace EventReview.Web.Api;

/// <summary>JSON shapes of an item's computation records and sign-offs (camelCase), as the dossier holds them.</summary>
public static class RecordDtos
{
    /// <summary>
    /// One run of a built-in check. <c>parameters</c> and <c>result</c> are the stored JSON (units are named in the field
    /// names and in <c>summary</c>); <c>contentSha256</c> is what sign-offs bind to, <c>seal</c> what the timeline records.
    /// </summary>
    public sealed record Computation(int Id, string Kind, string Verdict, string Summary, bool Current, JsonElement Parameters, JsonElement Result,
        string InputFingerprint, string ToolVersion, string ContentSha256, string Seal, string RunBy, DateTimeOffset RunAt, IReadOnlyList<string> PicturesSvg);

    /// <summary>
    /// A named reviewer's signature. <c>stale</c>: the item's evidence changed after signing, so it no longer counts;
    /// <c>signedAtGps</c> is GPS seconds.
    /// </summary>
    public sealed record SignOff(int Id, string Signer, string Meaning, string Statement, DateTimeOffset SignedAtUtc, decimal SignedAtGps,
        string EvidenceFingerprint, bool Stale, DateTimeOffset? StaleSince, string Seal);

    /// <summary>An item's sign-offs (every one, stale ones too, oldest first) beside its current evidence fingerprint and state.</summary>
    public sealed record ItemSignOffs(string ItemKey, string ItemState, string Fingerprint, int RequiredSignOffs, int CurrentSignOffs, IReadOnlyList<SignOff> SignOffs);

    public static Computation Of(ComputationRecord r, bool current) => new(r.Id, r.Kind, r.Verdict, r.Summary, current, Parse(r.ParametersJson), Parse(r.ResultJson),
        r.InputFingerprint, r.ToolVersion, r.ContentSha256, r.Seal(), r.RunByName, r.RunAt,
        r.PicturesSvg.Split(CheckRecords.PictureSeparator, StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries));

    public static SignOff Of(Core.Evidence.SignOff s) => new(s.Id, s.SignerName, s.Meaning.ToString().ToLowerInvariant(), s.Statement, s.SignedAtUtc,
        CaseDtos.Seconds(s.SignedAtGps), s.EvidenceFingerprint, s.IsStale, s.StaleSince, s.Seal());

    private static JsonElement Parse(string json)
    {
        using var doc = JsonDocument.Parse(string.IsNullOrWhiteSpace(json) ? "{}" : json);
        return doc.RootElement.Clone();
    }
}
