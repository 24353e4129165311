namespace EventReview.Core.Significance;

/// <summary>A sink that keeps every coincidence (for tests and small inputs; the list can be very long).</summary>
public sealed class CoincidenceListSink : ICoincidenceSink<CoincidenceListSink>
{
    private readonly TimeSlidePair _pair;
    private readonly List<SlideCoincidence> _items = [];

    /// <summary>Creates an empty list for a pair (used to fill in trigger times).</summary>
    public CoincidenceListSink(TimeSlidePair pair) => _pair = pair;

    /// <summary>The coincidences received, in arrival order.</summary>
    public IReadOnlyList<SlideCoincidence> Items => _items;

    /// <summary>The coincidences sorted by slide, then site-A index, then site-B index.</summary>
    public List<SlideCoincidence> Sorted() =>
        [.. _items.OrderBy(c => c.Slide).ThenBy(c => c.IndexA).ThenBy(c => c.IndexB)];

    /// <inheritdoc />
    public void Add(int slide, int indexA, int indexB, double statistic) => _items.Add(_pair.Coincidence(slide, indexA, indexB, statistic));

    /// <inheritdoc />
    public CoincidenceListSink CreatePart() => new(_pair);

    /// <inheritdoc />
    public void Merge(CoincidenceListSink part)
    {
        ArgumentNullException.ThrowIfNull(part);
        lock (_items)
        {
            _items.AddRange(part._items);
        }
    }
}
