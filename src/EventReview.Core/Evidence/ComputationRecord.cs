namespace EventReview.Core.Evidence;

/// <summary>
/// The stored run of a built-in check on a checklist item: kind, parameters, fingerprints of its inputs,
/// tool version, result (JSON), verdict, pictures (SVG), who ran it and when. Records are append-only:
/// re-running with changed inputs makes a new record; the newest record of a kind is the current one.
/// </summary>
public sealed class ComputationRecord
{
    private ComputationRecord()
    {
        Kind = string.Empty;
        ParametersJson = "{}";
        InputFingerprint = string.Empty;
        ToolVersion = string.Empty;
        ResultJson = "{}";
        Verdict = string.Empty;
        Summary = string.Empty;
        RunBy = string.Empty;
        RunByName = string.Empty;
        PicturesSvg = string.Empty;
    }

    /// <summary>Creates a record; <paramref name="inputFingerprint"/> is the SHA-256 over the canonical inputs.</summary>
    public ComputationRecord(string kind, string parametersJson, string inputFingerprint, string toolVersion, string resultJson,
        string verdict, string summary, string picturesSvg, Cases.Actor by, DateTimeOffset at)
    {
        if (!Checklists.CheckKind.IsKnown(kind))
        {
            throw new ArgumentException($"Unknown check kind '{kind}'.", nameof(kind));
        }

        Kind = kind;
        ParametersJson = parametersJson;
        InputFingerprint = inputFingerprint;
        ToolVersion = toolVersion;
        ResultJson = resultJson;
        Verdict = verdict;
        Summary = summary;
        PicturesSvg = picturesSvg;
        RunBy = by.UserId;
        RunByName = by.DisplayName;
        RunAt = Time.RecordedTime.Normalize(at);
    }

    public int Id { get; private set; }

    public int ChecklistItemId { get; private set; }

    public string Kind { get; private set; }

    public string ParametersJson { get; private set; }

    public string InputFingerprint { get; private set; }

    public string ToolVersion { get; private set; }

    public string ResultJson { get; private set; }

    /// <summary>One plain word of our own: "consistent", "inconsistent", "clear", "concern", ...</summary>
    public string Verdict { get; private set; }

    /// <summary>One line for tables: the key number with units and tolerance.</summary>
    public string Summary { get; private set; }

    /// <summary>Pictures as SVG documents, concatenated with a separator line "&lt;!--next--&gt;".</summary>
    public string PicturesSvg { get; private set; }

    public string RunBy { get; private set; }

    public string RunByName { get; private set; }

    /// <summary>When it ran, UTC, to whole milliseconds (<see cref="Time.RecordedTime"/>).</summary>
    public DateTimeOffset RunAt { get; private set; }

    /// <summary>SHA-256 over the content hash, pictures, summary, who ran it and when: recorded in the case timeline.</summary>
    public string Seal() => ComputeSeal(ContentSha256, Hashing.Sha256Hex(PicturesSvg), Summary, RunBy, RunByName, RunAt.UtcTicks);

    /// <summary>The seal (see <see cref="Seal"/>) from plain values; <paramref name="picturesSha256"/> is the SHA-256 of <see cref="PicturesSvg"/>.</summary>
    public static string ComputeSeal(string contentSha256, string picturesSha256, string summary, string runBy, string runByName, long runUtcTicks) =>
        Hashing.Sha256Hex(string.Join('\n', "eventreview-computation-row-v1", contentSha256, picturesSha256, summary, runBy, runByName,
            runUtcTicks.ToString(System.Globalization.CultureInfo.InvariantCulture)));

    /// <summary>SHA-256 over kind, parameters, input fingerprint, tool version and result (what the sign-off binds to).</summary>
    public string ContentSha256 => ComputeContentSha256(Kind, ParametersJson, InputFingerprint, ToolVersion, ResultJson, Verdict);

    /// <summary>
    /// The content hash from plain values: SHA-256 (lowercase hex) of the UTF-8 text
    /// <c>kind \n parametersJson \n inputFingerprint \n toolVersion \n resultJson \n verdict</c> (no trailing newline).
    /// Summary, pictures, runner and time are not part of it.
    /// </summary>
    public static string ComputeContentSha256(string kind, string parametersJson, string inputFingerprint, string toolVersion, string resultJson, string verdict) =>
        Hashing.Sha256Hex($"{kind}\n{parametersJson}\n{inputFingerprint}\n{toolVersion}\n{resultJson}\n{verdict}");
}
