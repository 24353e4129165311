using System.Globalization;
using System.Text;
using EventReview.Core.Evidence;

namespace EventReview.Core.Configuration;

/// <summary>
/// The canonical serialisation of a frozen configuration snapshot and its fingerprint (documented in
/// <c>docs/formats/configuration-fingerprint.md</c>). The text is UTF-8, every line ends in '\n':
/// <code>
/// eventreview-configuration-v1
/// site=&lt;site code&gt;
/// label=&lt;label&gt;
/// freeze-from=&lt;UTC, yyyy-MM-ddTHH:mm:ss.fffffffZ&gt;
/// freeze-until=&lt;UTC, same format&gt;
/// reason=&lt;reason&gt;
/// items=&lt;number of items, decimal&gt;
/// &lt;key&gt;=&lt;value&gt;          (one line per item, keys in ordinal order)
/// </code>
/// In label, reason, keys and values the characters backslash, line feed, carriage return and '=' are escaped as
/// <c>\\</c>, <c>\n</c>, <c>\r</c> and <c>\=</c>, so every line splits unambiguously at its first unescaped '='.
/// The fingerprint is the lowercase hex SHA-256 of the text. Who captured or froze the snapshot, and when, are not
/// part of it (the case timeline records the freeze with the fingerprint).
/// </summary>
public static class ConfigurationCanonical
{
    /// <summary>First line of the canonical text (bump the version when the format changes).</summary>
    public const string Header = "eventreview-configuration-v1";

    /// <summary>The canonical text of a frozen snapshot.</summary>
    /// <exception cref="ArgumentException">When the snapshot's freeze fields are not set.</exception>
    public static string Text(ConfigurationSnapshot snapshot)
    {
        ArgumentNullException.ThrowIfNull(snapshot);
        if (snapshot.FreezeFrom is not { } from || snapshot.FreezeUntil is not { } until || snapshot.FreezeReason is null)
        {
            throw new ArgumentException("The snapshot has no freeze period and reason; only a frozen snapshot has a fingerprint.", nameof(snapshot));
        }

        return Text(snapshot.SiteCode, snapshot.Label, from, until, snapshot.FreezeReason, snapshot.Items);
    }

    /// <summary>The canonical text from plain values (offline verification).</summary>
    public static string Text(string siteCode, string label, DateTimeOffset freezeFrom, DateTimeOffset freezeUntil, string reason, IReadOnlyDictionary<string, string> items)
    {
        ArgumentNullException.ThrowIfNull(items);
        var sb = new StringBuilder(Header).Append('\n');
        sb.Append("site=").Append(Escape(siteCode)).Append('\n');
        sb.Append("label=").Append(Escape(label)).Append('\n');
        sb.Append("freeze-from=").Append(Utc(freezeFrom)).Append('\n');
        sb.Append("freeze-until=").Append(Utc(freezeUntil)).Append('\n');
        sb.Append("reason=").Append(Escape(reason)).Append('\n');
        sb.Append("items=").Append(items.Count.ToString(CultureInfo.InvariantCulture)).Append('\n');
        foreach (var key in items.Keys.Order(StringComparer.Ordinal))
        {
            sb.Append(Escape(key)).Append('=').Append(Escape(items[key])).Append('\n');
        }

        return sb.ToString();
    }

    /// <summary>Fingerprint of a frozen snapshot: lowercase hex SHA-256 of <see cref="Text(ConfigurationSnapshot)"/>.</summary>
    public static string Fingerprint(ConfigurationSnapshot snapshot) => Hashing.Sha256Hex(Text(snapshot));

    /// <summary>Fingerprint from plain values: lowercase hex SHA-256 of the canonical text.</summary>
    public static string Fingerprint(string siteCode, string label, DateTimeOffset freezeFrom, DateTimeOffset freezeUntil, string reason, IReadOnlyDictionary<string, string> items) =>
        Hashing.Sha256Hex(Text(siteCode, label, freezeFrom, freezeUntil, reason, items));

    /// <summary>Escapes backslash, line feed, carriage return and '=' (see the class remarks).</summary>
    public static string Escape(string value)
    {
        var sb = new StringBuilder(value.Length);
        foreach (var c in value)
        {
            sb.Append(c switch
            {
                '\\' => "\\\\",
                '\n' => "\\n",
                '\r' => "\\r",
                '=' => "\\=",
                _ => c.ToString(),
            });
        }

        return sb.ToString();
    }

    /// <summary>A time as written in the canonical text: UTC, <c>yyyy-MM-ddTHH:mm:ss.fffffffZ</c>.</summary>
    public static string Utc(DateTimeOffset at) => at.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fffffff'Z'", CultureInfo.InvariantCulture);
}
