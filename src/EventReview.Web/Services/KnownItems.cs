using System.Collections.Concurrent;

namespace EventReview.Web.Services;

/// <summary>
/// Checklist items this server has seen exist, so that an upload can be checked against its item without a database
/// read. Items are never deleted (cases and their checklists are append-only), so a remembered item stays true; an
/// item not remembered is looked up in the database. Bounded: forgets everything when full.
/// </summary>
public sealed class KnownItems
{
    private const int MaxEntries = 200_000;
    private readonly ConcurrentDictionary<(int CaseId, string Key), byte> _items = new();

    public bool Contains(int caseId, string key) => _items.ContainsKey((caseId, key));

    public void Remember(int caseId, IEnumerable<string> keys)
    {
        if (_items.Count >= MaxEntries)
        {
            _items.Clear();
        }

        foreach (var key in keys)
        {
            _items.TryAdd((caseId, key), 0);
        }
    }
}
