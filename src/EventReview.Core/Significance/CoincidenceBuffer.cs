namespace EventReview.Core.Significance;

/// <summary>Collects a finder's coincidences and hands them on in batches (one indirect call per batch, not per coincidence).</summary>
internal sealed class CoincidenceBuffer(Action<FoundCoincidence[], int> flush)
{
    private const int Capacity = 4096;
    private readonly FoundCoincidence[] _items = new FoundCoincidence[Capacity];
    private int _count;

    public long Total { get; private set; }

    public static CoincidenceBuffer For<TSink>(TSink sink)
        where TSink : class, ICoincidenceSink<TSink> => new((items, n) => sink.AddBatch(items.AsSpan(0, n)));

    public void Add(int slide, int indexA, int indexB, double statistic)
    {
        _items[_count++] = new FoundCoincidence(slide, indexA, indexB, statistic);
        if (_count == Capacity)
        {
            Flush();
        }
    }

    public void Flush()
    {
        if (_count > 0)
        {
            flush(_items, _count);
            Total += _count;
            _count = 0;
        }
    }
}
