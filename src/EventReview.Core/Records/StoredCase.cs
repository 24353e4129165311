using EventReview.Core.Cases;
using EventReview.Core.Configuration;
using EventReview.Core.Evidence;

namespace EventReview.Core.Records;

/// <summary>
/// A case's rows as stored (in the database, or in a dossier), in the same terms as <see cref="RecordedCase"/>: its field
/// facts (<see cref="CaseFacts.Fields(ReviewCase)"/>), its evidence, computation and sign-off rows with their seals, and
/// the configuration records frozen for it. Compared with the record by <see cref="CaseRecordCheck"/>.
/// </summary>
public sealed class StoredCase
{
    /// <summary>Field facts by name.</summary>
    public required IReadOnlyDictionary<string, string> Fields { get; init; }

    /// <summary>Evidence, computation and sign-off rows.</summary>
    public required IReadOnlyList<StoredRow> Rows { get; init; }

    /// <summary>Configuration records marked as belonging to the case; null when not known (then not compared).</summary>
    public IReadOnlyList<StoredConfiguration>? Configurations { get; init; }

    /// <summary>UTC ticks of the stored last-change time, or null when not compared.</summary>
    public long? UpdatedAtUtcTicks { get; init; }

    /// <summary>The stored state of a loaded case; <paramref name="configurations"/> are the snapshots whose case is this one.</summary>
    public static StoredCase Of(ReviewCase c, IEnumerable<ConfigurationSnapshot>? configurations)
    {
        ArgumentNullException.ThrowIfNull(c);
        var rows = new List<StoredRow>();
        foreach (var i in c.Items)
        {
            rows.AddRange(i.Evidence.Select(e => new StoredRow("evidence", i.Key, e.Seal(), e.DetailSha256(), false, null,
                $"{Kind(e)} added by {e.AddedByName} at {Utc(e.AddedAt)}")));
            rows.AddRange(i.Computations.Select(r => new StoredRow("computation", i.Key, r.Seal(), string.Empty, false, null,
                $"'{r.Kind}' computation record run by {r.RunByName} at {Utc(r.RunAt)}")));
            rows.AddRange(i.SignOffs.Select(s => new StoredRow("signoff", i.Key, s.Seal(), string.Empty, s.IsStale, s.StaleSince?.UtcTicks,
                $"sign-off by {s.SignerName} (signed {Utc(s.SignedAtUtc)})")));
        }

        return new StoredCase
        {
            Fields = ToDictionary(CaseFacts.Fields(c)),
            Rows = rows,
            Configurations = configurations?.Select(StoredConfiguration.Of).ToList(),
            UpdatedAtUtcTicks = c.UpdatedAt.UtcTicks,
        };
    }

    /// <summary>Facts by name (a later fact of the same name wins).</summary>
    public static Dictionary<string, string> ToDictionary(IEnumerable<Fact> facts)
    {
        var d = new Dictionary<string, string>(StringComparer.Ordinal);
        foreach (var f in facts)
        {
            d[f.Name] = f.Value;
        }

        return d;
    }

    internal static string Utc(DateTimeOffset t) => t.UtcDateTime.ToString("yyyy-MM-dd HH:mm:ss", System.Globalization.CultureInfo.InvariantCulture) + " UTC";

    private static string Kind(EvidenceItem e) => e.Kind switch
    {
        EvidenceKind.Attachment => $"file '{e.FileName}'",
        EvidenceKind.Link => "link",
        _ => "note",
    };
}
