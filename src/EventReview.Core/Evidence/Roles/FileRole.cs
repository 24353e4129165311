using EventReview.Core.Inputs;

namespace EventReview.Core.Evidence.Roles;

/// <summary>
/// The role of an attached file: its kind and, for per-site inputs (strain, search triggers, analysed time), the site.
/// Stored on the evidence row as its <see cref="Word"/> ("strain:KP", "dq-segments"), which is sealed with the row.
/// </summary>
/// <param name="Kind">What the file is for.</param>
/// <param name="Site">Site code (1-8 upper-case letters or digits) for per-site kinds; null when not stated or not per site.</param>
public sealed record FileRole(FileRoleKind Kind, string? Site = null)
{
    /// <summary>Longest stored word: the kind's word, a colon and an 8-character site code.</summary>
    public const int MaxWordLength = 32;

    private static readonly (FileRoleKind Kind, string Word, string Title, bool PerSite)[] Table =
    [
        (FileRoleKind.Other, "other", "other (not a check input)", false),
        (FileRoleKind.Strain, "strain", "strain", true),
        (FileRoleKind.DataQualitySegments, "dq-segments", "data-quality segments", false),
        (FileRoleKind.AuxiliaryTriggers, "aux-triggers", "auxiliary and environmental triggers", false),
        (FileRoleKind.SensorInventory, "sensor-inventory", "sensor inventory", false),
        (FileRoleKind.CouplingFunction, "coupling-function", "coupling function", false),
        (FileRoleKind.SensorSeries, "sensor-series", "sensor time series", false),
        (FileRoleKind.InjectionLog, "injection-log", "injection log", false),
        (FileRoleKind.BlindInjectionRecord, "blind-record", "blind-injection record", false),
        (FileRoleKind.SearchTriggers, "search-triggers", "search triggers", true),
        (FileRoleKind.AnalysedTime, "analysed-time", "analysed time", true),
        (FileRoleKind.StageInput, "stage-input", "data-chain stage input", false),
        (FileRoleKind.StageOutput, "stage-output", "data-chain stage output", false),
        (FileRoleKind.StageModel, "stage-model", "data-chain stage models", false),
        (FileRoleKind.Configuration, "configuration", "configuration snapshot", false),
    ];

    /// <summary>Every kind, in the order pickers list them.</summary>
    public static IReadOnlyList<FileRoleKind> Kinds { get; } = [.. Table.Select(r => r.Kind)];

    /// <summary>The stored word: the kind's word, then ":SITE" when a site is given ("strain:KP").</summary>
    public string Word => Site is null ? KindWord(Kind) : $"{KindWord(Kind)}:{Site}";

    /// <summary>Plain words for people: "strain of site KP", "data-quality segments".</summary>
    public string Title => Site is null ? KindTitle(Kind) : $"{KindTitle(Kind)} of site {Site}";

    /// <summary>The stored word of a kind ("dq-segments").</summary>
    public static string KindWord(FileRoleKind kind) => Row(kind).Word;

    /// <summary>The plain title of a kind ("data-quality segments").</summary>
    public static string KindTitle(FileRoleKind kind) => Row(kind).Title;

    /// <summary>True for kinds that belong to one site (strain, search triggers, analysed time).</summary>
    public static bool IsPerSite(FileRoleKind kind) => Row(kind).PerSite;

    /// <summary>True when this role serves <paramref name="wanted"/>: the same kind, and the same site when both name one.</summary>
    public bool Serves(FileRoleKind wanted, string? site = null) =>
        Kind == wanted && (site is null || Site is null || string.Equals(Site, site, StringComparison.OrdinalIgnoreCase));

    /// <summary>Reads a stored or submitted word ("strain:KP", "dq-segments"; case-insensitive, surrounding blanks ignored).</summary>
    /// <exception cref="ArgumentException">Naming <paramref name="field"/>: an unknown kind, a site on a kind that has none, or a malformed site code.</exception>
    public static FileRole Parse(string word, string field = "role")
    {
        var text = InputGuard.Identifier(word, MaxWordLength, field);
        var colon = text.IndexOf(':', StringComparison.Ordinal);
        var kindWord = (colon < 0 ? text : text[..colon]).ToLowerInvariant();
        var site = colon < 0 ? null : text[(colon + 1)..].Trim().ToUpperInvariant();
        var row = Array.Find(Table, r => r.Word == kindWord);
        if (row.Word is null)
        {
            throw new ArgumentException($"{field}: '{kindWord}' is not a file role (known: {string.Join(", ", Table.Select(r => r.Word))}; per-site roles take ':SITE', e.g. strain:KP).", field);
        }

        if (site is not null)
        {
            if (!row.PerSite)
            {
                throw new ArgumentException($"{field}: the role '{kindWord}' does not belong to one site; leave out ':{site}'.", field);
            }

            if (site.Length is < 1 or > 8 || !site.All(char.IsAsciiLetterOrDigit))
            {
                throw new ArgumentException($"{field}: '{site}' is not a site code (1-8 letters or digits).", field);
            }
        }

        return new FileRole(row.Kind, site);
    }

    /// <summary>Like <see cref="Parse"/>, but null for a null, empty or unreadable word (rows stored before roles existed).</summary>
    public static FileRole? TryParse(string? word)
    {
        if (string.IsNullOrWhiteSpace(word))
        {
            return null;
        }

        try
        {
            return Parse(word);
        }
        catch (ArgumentException)
        {
            return null;
        }
    }

    /// <inheritdoc />
    public override string ToString() => Word;

    private static (FileRoleKind Kind, string Word, string Title, bool PerSite) Row(FileRoleKind kind)
    {
        foreach (var row in Table)
        {
            if (row.Kind == kind)
            {
                return row;
            }
        }

        throw new ArgumentOutOfRangeException(nameof(kind), kind, "File role kind has no stored word.");
    }
}
