using System.Text.Encodings.Web;
using System.Text.Json;
using EventReview.Core.Cases;

namespace EventReview.Core.Configuration;

/// <summary>
/// A site's configuration at one moment: named items (software and firmware versions, filter and model checksums,
/// calibration version, channel lists, seal numbers, notes) with who captured them and when. A coordinator may
/// <see cref="Freeze"/> a snapshot for a case with a freeze period and a reason; the frozen record gets a
/// <see cref="Fingerprint"/> (see <see cref="ConfigurationCanonical"/>) and never changes again: this class offers
/// no way to edit items, and the database rejects UPDATE and DELETE on frozen rows.
/// </summary>
public sealed class ConfigurationSnapshot
{
    private static readonly JsonSerializerOptions ItemsJsonOptions = new() { Encoder = JavaScriptEncoder.UnsafeRelaxedJsonEscaping };

    private IReadOnlyDictionary<string, string>? _items;

    private ConfigurationSnapshot()
    {
        SiteCode = string.Empty;
        Label = string.Empty;
        CapturedBy = string.Empty;
        CapturedByName = string.Empty;
        ItemsJson = "{}";
    }

    public int Id { get; private set; }

    /// <summary>The case the snapshot belongs to; null for a snapshot captured outside a case (set by <see cref="Freeze"/>).</summary>
    public int? ReviewCaseId { get; private set; }

    /// <summary>Site code, upper case, 1-8 letters or digits (as <see cref="Network.Site.Code"/>).</summary>
    public string SiteCode { get; private set; }

    /// <summary>Short description ("after maintenance", "as imported from file x").</summary>
    public string Label { get; private set; }

    /// <summary>User id of whoever captured the snapshot.</summary>
    public string CapturedBy { get; private set; }

    public string CapturedByName { get; private set; }

    public DateTimeOffset CapturedAt { get; private set; }

    /// <summary>The items as a canonical JSON object: keys in ordinal order, string values, no white space.</summary>
    public string ItemsJson { get; private set; }

    public bool IsFrozen { get; private set; }

    public string? FrozenBy { get; private set; }

    public string? FrozenByName { get; private set; }

    public DateTimeOffset? FrozenAt { get; private set; }

    /// <summary>Start of the freeze period (inclusive).</summary>
    public DateTimeOffset? FreezeFrom { get; private set; }

    /// <summary>End of the freeze period (inclusive); later than <see cref="FreezeFrom"/>.</summary>
    public DateTimeOffset? FreezeUntil { get; private set; }

    public string? FreezeReason { get; private set; }

    /// <summary>SHA-256 (lowercase hex) of the canonical serialisation, set at freeze; null before.</summary>
    public string? Fingerprint { get; private set; }

    /// <summary>The items, sorted by key (parsed from <see cref="ItemsJson"/>; not mapped).</summary>
    public IReadOnlyDictionary<string, string> Items => _items ??= ParseItems(ItemsJson);

    /// <summary>Captures a snapshot of <paramref name="items"/> at site <paramref name="siteCode"/>.</summary>
    /// <exception cref="ArgumentException">When the site code, label or an item is invalid (the message names it).</exception>
    public static ConfigurationSnapshot Capture(string siteCode, string label, IReadOnlyDictionary<string, string> items, Actor by, DateTimeOffset at, int? reviewCaseId = null)
    {
        ArgumentNullException.ThrowIfNull(items);
        ArgumentNullException.ThrowIfNull(by);
        var code = (siteCode ?? string.Empty).Trim().ToUpperInvariant();
        if (code.Length is < 1 or > 8 || !code.All(char.IsAsciiLetterOrDigit))
        {
            throw new ArgumentException("siteCode must be 1-8 letters or digits.", nameof(siteCode));
        }

        label = (label ?? string.Empty).Trim();
        if (label.Length > 200 || label.Any(char.IsControl))
        {
            throw new ArgumentException("label must be at most 200 printable characters.", nameof(label));
        }

        if (items.Count > ConfigurationImport.MaxKeys)
        {
            throw new ArgumentException($"items: at most {ConfigurationImport.MaxKeys} items.", nameof(items));
        }

        foreach (var (key, value) in items)
        {
            if (!ConfigurationImport.IsValidKey(key))
            {
                throw new ArgumentException($"items: key '{key}' must be 1-{ConfigurationImport.MaxKeyLength} characters of A-Z a-z 0-9 _ . : / - [ ].", nameof(items));
            }

            if (value is null || value.Length > ConfigurationImport.MaxValueLength)
            {
                throw new ArgumentException($"items: the value of '{key}' is missing or longer than {ConfigurationImport.MaxValueLength} characters.", nameof(items));
            }
        }

        var sorted = new SortedDictionary<string, string>(items.ToDictionary(), StringComparer.Ordinal);
        return new ConfigurationSnapshot
        {
            ReviewCaseId = reviewCaseId,
            SiteCode = code,
            Label = label,
            CapturedBy = by.UserId,
            CapturedByName = by.DisplayName,
            CapturedAt = Time.RecordedTime.Normalize(at),
            ItemsJson = JsonSerializer.Serialize(sorted, ItemsJsonOptions),
            _items = sorted,
        };
    }

    /// <summary>
    /// Freezes the snapshot for case <paramref name="reviewCaseId"/> over [<paramref name="from"/>, <paramref name="until"/>]
    /// and sets <see cref="Fingerprint"/>. Refused (with <see cref="DomainRuleException"/>, nothing changed) when already
    /// frozen ("already-frozen"), when the snapshot belongs to another case ("other-case"), when <paramref name="until"/>
    /// is not after <paramref name="from"/> ("freeze-period") or when the reason is empty ("reason-required").
    /// </summary>
    public void Freeze(int reviewCaseId, DateTimeOffset from, DateTimeOffset until, string reason, Actor by, DateTimeOffset at)
    {
        ArgumentNullException.ThrowIfNull(by);
        if (IsFrozen)
        {
            throw new DomainRuleException("already-frozen", $"The configuration snapshot of {SiteCode} ('{Label}') is already frozen (fingerprint {Fingerprint?[..12]}); it can never change.");
        }

        if (ReviewCaseId is { } other && other != reviewCaseId)
        {
            throw new DomainRuleException("other-case", $"The configuration snapshot of {SiteCode} belongs to another case; capture a new snapshot for this case.");
        }

        if (Time.RecordedTime.Normalize(until) <= Time.RecordedTime.Normalize(from))
        {
            throw new DomainRuleException("freeze-period", $"The freeze period must end after it starts (from {from:u}, until {until:u}).");
        }

        if (string.IsNullOrWhiteSpace(reason))
        {
            throw new DomainRuleException("reason-required", "Freezing a configuration needs a reason.");
        }

        Inputs.InputGuard.Text(reason.Trim(), Inputs.InputLimits.MaxStatementLength, nameof(reason));

        ReviewCaseId = reviewCaseId;
        IsFrozen = true;
        FrozenBy = by.UserId;
        FrozenByName = by.DisplayName;
        // Whole milliseconds, as every time that enters a hash (PostgreSQL keeps microseconds, so 100 ns ticks would not survive a save).
        FrozenAt = Time.RecordedTime.Normalize(at);
        FreezeFrom = Time.RecordedTime.Normalize(from);
        FreezeUntil = Time.RecordedTime.Normalize(until);
        FreezeReason = reason.Trim();
        Fingerprint = ConfigurationCanonical.Fingerprint(this);
    }

    /// <summary>
    /// True when the record is frozen and its stored fingerprint still recomputes from its items, period and reason;
    /// false when not frozen, or when something was changed after freezing (or its items cannot be read).
    /// </summary>
    public bool FingerprintMatches()
    {
        if (!IsFrozen || Fingerprint is null || FreezeFrom is null || FreezeUntil is null || FreezeReason is null)
        {
            return false;
        }

        try
        {
            return string.Equals(ConfigurationCanonical.Fingerprint(this), Fingerprint, StringComparison.Ordinal);
        }
        catch (JsonException)
        {
            return false;
        }
    }

    /// <summary>True when <paramref name="at"/> lies inside the freeze period (bounds inclusive); false when not frozen.</summary>
    public bool InFreezePeriod(DateTimeOffset at) => IsFrozen && at >= FreezeFrom && at <= FreezeUntil;

    private static SortedDictionary<string, string> ParseItems(string json) =>
        new(JsonSerializer.Deserialize<Dictionary<string, string>>(json) ?? [], StringComparer.Ordinal);
}
