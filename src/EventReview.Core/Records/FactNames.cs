namespace EventReview.Core.Records;

/// <summary>
/// The names of facts (see <see cref="Fact"/>). Case fields: <c>case.&lt;field&gt;</c>; arrivals:
/// <c>arrival[SITE]</c> = "GPS-nanoseconds SNR"; item fields: <c>item[KEY].&lt;field&gt;</c>; rows added to an item:
/// <c>evidence[KEY]+</c> = "seal detail", <c>computation[KEY]+</c> = "seal", <c>signoff[KEY]+</c> = "seal";
/// a sign-off made stale: <c>signoff[KEY].stale</c> = "seal stale-since-utc-ticks"; a configuration record frozen for
/// the case: <c>configuration+</c> = "record-id fingerprint detail". Enumerations are written with their member names
/// (<c>InReview</c>, <c>ReadyForSignOff</c>), times as UTC ticks, hashes as lowercase hex SHA-256.
/// </summary>
public static class FactNames
{
    /// <summary>Field names of the case (<c>case.&lt;name&gt;</c>).</summary>
    public const string Candidate = "candidate", Gps = "gps", Search = "search", Summary = "summary", Coordinator = "coordinator",
        CoordinatorName = "coordinator-name", Checklist = "checklist", ChecklistVersion = "checklist-version", Created = "created",
        State = "state", Outcome = "outcome", Closing = "closing";

    /// <summary>Field names of an item (<c>item[KEY].&lt;name&gt;</c>); <see cref="State"/> is shared with the case.</summary>
    public const string Section = "section", SectionTitle = "section-title", SectionOrder = "section-order", Order = "order", Title = "title",
        Guidance = "guidance", Check = "check", Required = "required", OwnerMaySign = "owner-may-sign", Due = "due", Owner = "owner",
        OwnerName = "owner-name";

    /// <summary>Name of the fact that adds a frozen configuration record to the case.</summary>
    public const string ConfigurationAdded = "configuration+";

    public static string Case(string field) => "case." + field;

    public static string Arrival(string site) => $"arrival[{site}]";

    public static string Item(string key, string field) => $"item[{key}].{field}";

    public static string EvidenceAdded(string key) => $"evidence[{key}]+";

    public static string ComputationAdded(string key) => $"computation[{key}]+";

    public static string SignOffAdded(string key) => $"signoff[{key}]+";

    public static string SignOffStale(string key) => $"signoff[{key}].stale";

    /// <summary>
    /// Splits a name into its part ("case", "arrival", "item", "evidence", "computation", "signoff", "configuration"),
    /// the key in brackets (site, item key; null for the case and configurations) and the rest ("state", "+", "stale").
    /// </summary>
    public static bool TryParse(string name, out string part, out string? key, out string rest)
    {
        part = rest = string.Empty;
        key = null;
        if (name.StartsWith("case.", StringComparison.Ordinal))
        {
            (part, rest) = ("case", name[5..]);
            return rest.Length > 0;
        }

        if (name == ConfigurationAdded)
        {
            (part, rest) = ("configuration", "+");
            return true;
        }

        var open = name.IndexOf('[', StringComparison.Ordinal);
        var close = name.LastIndexOf(']');
        if (open < 1 || close < open + 2)
        {
            return false;
        }

        part = name[..open];
        key = name[(open + 1)..close];
        var tail = name[(close + 1)..];
        rest = tail.StartsWith('.') ? tail[1..] : tail;
        return part switch
        {
            "arrival" => tail.Length == 0,
            "item" => tail.StartsWith('.') && rest.Length > 0,
            "evidence" or "computation" => tail == "+",
            "signoff" => tail is "+" or ".stale",
            _ => false,
        };
    }

    /// <summary>Words for a field name in messages ("state", "owner", "due date", ...).</summary>
    public static string Label(string field) => field switch
    {
        Candidate => "candidate id",
        Gps => "GPS time (ns)",
        Summary => "summary (SHA-256)",
        Coordinator => "coordinator id",
        CoordinatorName => "coordinator name",
        Checklist => "checklist template",
        ChecklistVersion => "checklist version",
        Created => "opening time (UTC ticks)",
        Closing => "closing statement",
        Section => "section",
        SectionTitle => "section title",
        SectionOrder => "section position",
        Order => "position",
        Guidance => "guidance (SHA-256)",
        Check => "check kind",
        Required => "required sign-offs",
        OwnerMaySign => "owner-may-sign rule",
        Due => "due date",
        Owner => "owner id",
        OwnerName => "owner name",
        _ => field,
    };
}
