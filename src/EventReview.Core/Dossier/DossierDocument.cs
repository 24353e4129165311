using System.Text.Json.Serialization;

namespace EventReview.Core.Dossier;

/// <summary>
/// Everything machine-readable about one case, as written to <c>dossier.json</c> (camelCase, documented in
/// <c>docs/formats/dossier.md</c>). Times appear twice: as ISO 8601 UTC text (<c>...Utc</c>, 7 fractional digits,
/// 'Z') and as UTC ticks (<c>...UtcTicks</c>, 100 ns units since 0001-01-01T00:00:00Z), which are what hashes use.
/// GPS times are integer nanoseconds since the GPS epoch plus decimal seconds as text. Built by
/// <see cref="DossierBuilder"/> without clock or randomness, so an unchanged case always gives the same document.
/// </summary>
/// <param name="SchemaVersion">Always <see cref="DossierDocument.CurrentSchemaVersion"/> for this layout.</param>
/// <param name="Generator">Program that wrote the document.</param>
/// <param name="Case">The case summary.</param>
/// <param name="Arrivals">Arrivals by site code.</param>
/// <param name="Sites">Network sites used (by arrivals or configuration snapshots), by code.</param>
/// <param name="Items">Checklist items in section then item order.</param>
/// <param name="Configurations">Configuration snapshots by site, then capture time.</param>
/// <param name="Timeline">Every timeline entry by sequence, with every field the hash chain covers.</param>
/// <param name="ChainHead">Hash of the last timeline entry (the genesis hash for an empty timeline).</param>
public sealed record DossierDocument(
    string SchemaVersion,
    DossierGenerator Generator,
    DossierCase Case,
    IReadOnlyList<DossierArrival> Arrivals,
    IReadOnlyList<DossierSite> Sites,
    IReadOnlyList<DossierItem> Items,
    IReadOnlyList<DossierConfiguration> Configurations,
    IReadOnlyList<DossierTimelineEntry> Timeline,
    string ChainHead)
{
    /// <summary>The schema version this code writes and reads (3: attachments keep a safe form of their name, <see cref="AttachmentNames"/>).</summary>
    public const string CurrentSchemaVersion = "eventreview-dossier/3";

    /// <summary>The second schema version (attachments named by their SHA-256 alone): still read and verified.</summary>
    public const string Version2SchemaVersion = "eventreview-dossier/2";

    /// <summary>The first schema version (no facts, unsigned manifest): still read, always reported unsigned.</summary>
    public const string LegacySchemaVersion = "eventreview-dossier/1";

    /// <summary>Whether this code reads <paramref name="schemaVersion"/> (3, 2 or the legacy 1).</summary>
    public static bool Reads(string? schemaVersion) => schemaVersion is CurrentSchemaVersion or Version2SchemaVersion or LegacySchemaVersion;

    /// <summary>The ZIP path of an attachment in a dossier of <paramref name="schemaVersion"/>: hash and safe name from 3 on, the hash alone before.</summary>
    public static string AttachmentPath(string schemaVersion, string sha256, string? fileName) =>
        schemaVersion == CurrentSchemaVersion ? AttachmentNames.PathOf(sha256, fileName) : "attachments/" + sha256;

    /// <summary>
    /// The SVG pictures named in <see cref="DossierComputation.Pictures"/>, keyed by file name ("pictures/1.svg").
    /// Not part of <c>dossier.json</c>: the exporter writes each as its own file (covered by the manifest).
    /// </summary>
    [JsonIgnore]
    public IReadOnlyDictionary<string, string> PictureSvgs { get; init; } = new Dictionary<string, string>();
}
