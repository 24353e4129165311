using System.Globalization;

namespace EventReview.Core.Time;

/// <summary>
/// The leap-second table used for GPS &lt;-&gt; UTC conversion, loaded from the bundled
/// <c>Time/leap-seconds.txt</c> (format documented in that file) or from any text in the same format.
/// Rows are sorted by date; the table carries an expiry date after which it may be incomplete.
/// </summary>
public sealed class LeapSecondTable
{
    private static readonly Lazy<LeapSecondTable> BundledTable = new(LoadBundled);
    private readonly List<LeapSecondEntry> _entries;

    private LeapSecondTable(List<LeapSecondEntry> entries, DateOnly expiresUtc)
    {
        _entries = entries;
        ExpiresUtc = expiresUtc;
    }

    /// <summary>The table bundled with the application (embedded resource).</summary>
    public static LeapSecondTable Bundled => BundledTable.Value;

    /// <summary>Rows in date order; the first row is the offset at the GPS epoch.</summary>
    public IReadOnlyList<LeapSecondEntry> Entries => _entries;

    /// <summary>Date (UTC) up to which the table is known to be complete.</summary>
    public DateOnly ExpiresUtc { get; }

    /// <summary>True when <paramref name="utcNow"/> is on or after the expiry date: show a warning, conversions after it may miss a leap second.</summary>
    public bool IsStale(DateTime utcNow) => DateOnly.FromDateTime(utcNow) >= ExpiresUtc;

    /// <summary>True when an instant (UTC) lies on or after the expiry date, so its conversion is not guaranteed.</summary>
    public bool Covers(DateTime utc) => DateOnly.FromDateTime(utc) < ExpiresUtc;

    /// <summary>Parses a table in the documented text format.</summary>
    /// <exception cref="FormatException">Naming the line when a line is malformed, rows are out of order, TAI-UTC - GPS-UTC is not 19, or the expiry line is missing.</exception>
    public static LeapSecondTable Parse(TextReader reader)
    {
        ArgumentNullException.ThrowIfNull(reader);
        var entries = new List<LeapSecondEntry>();
        DateOnly? expires = null;
        var lineNumber = 0;
        while (reader.ReadLine() is { } raw)
        {
            lineNumber++;
            var hash = raw.IndexOf('#', StringComparison.Ordinal);
            var line = (hash >= 0 ? raw[..hash] : raw).Trim();
            if (line.Length == 0)
            {
                continue;
            }

            var parts = line.Split((char[]?)null, StringSplitOptions.RemoveEmptyEntries);
            if (parts[0] == "expires")
            {
                if (parts.Length != 2 || !TryDate(parts[1], out var e))
                {
                    throw new FormatException($"Leap-second table line {lineNumber}: expected 'expires YYYY-MM-DD'.");
                }

                expires = e;
                continue;
            }

            if (parts.Length != 3 || !TryDate(parts[0], out var date)
                || !int.TryParse(parts[1], NumberStyles.Integer, CultureInfo.InvariantCulture, out var tai)
                || !int.TryParse(parts[2], NumberStyles.Integer, CultureInfo.InvariantCulture, out var gps))
            {
                throw new FormatException($"Leap-second table line {lineNumber}: expected 'YYYY-MM-DD TAI-UTC GPS-UTC'.");
            }

            if (tai - gps != 19)
            {
                throw new FormatException($"Leap-second table line {lineNumber}: TAI-UTC minus GPS-UTC must be 19 s.");
            }

            if (entries.Count > 0 && date <= entries[^1].StartsUtc)
            {
                throw new FormatException($"Leap-second table line {lineNumber}: dates must increase.");
            }

            entries.Add(new LeapSecondEntry(date, tai, gps));
        }

        if (entries.Count == 0)
        {
            throw new FormatException("Leap-second table has no rows.");
        }

        if (expires is null)
        {
            throw new FormatException("Leap-second table has no 'expires' line.");
        }

        return new LeapSecondTable(entries, expires.Value);
    }

    /// <summary>The row in force at a UTC date-time (the first row for instants before it).</summary>
    public LeapSecondEntry EntryAtUtc(DateTime utc)
    {
        var day = DateOnly.FromDateTime(utc);
        var found = _entries[0];
        foreach (var entry in _entries)
        {
            if (entry.StartsUtc <= day)
            {
                found = entry;
            }
        }

        return found;
    }

    /// <summary>Index of the row in force at a GPS whole second (0 for seconds before the second row).</summary>
    public int IndexAtGpsSecond(long gpsSeconds)
    {
        var index = 0;
        for (var i = 1; i < _entries.Count; i++)
        {
            if (_entries[i].StartsGpsSeconds <= gpsSeconds)
            {
                index = i;
            }
        }

        return index;
    }

    private static bool TryDate(string text, out DateOnly date) =>
        DateOnly.TryParseExact(text, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out date);

    private static LeapSecondTable LoadBundled()
    {
        using var stream = typeof(LeapSecondTable).Assembly.GetManifestResourceStream("EventReview.Core.Time.leap-seconds.txt")
            ?? throw new InvalidOperationException("The bundled leap-second table resource is missing.");
        using var reader = new StreamReader(stream);
        return Parse(reader);
    }
}
