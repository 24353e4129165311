namespace EventReview.Core.Significance;

/// <summary>
/// Receives background coincidences as a finder produces them. Finders may run on several threads: each
/// thread fills its own part (<see cref="CreatePart"/>) and the parts are merged into the original at the end.
/// </summary>
/// <typeparam name="TSelf">The implementing type.</typeparam>
public interface ICoincidenceSink<TSelf>
    where TSelf : class, ICoincidenceSink<TSelf>
{
    /// <summary>One coincidence: slide k, trigger indices into the sorted lists of sites A and B, ranking statistic.</summary>
    void Add(int slide, int indexA, int indexB, double statistic);

    /// <summary>A batch of coincidences (finders call this with buffers of a few thousand).</summary>
    void AddBatch(ReadOnlySpan<FoundCoincidence> batch)
    {
        foreach (var c in batch)
        {
            Add(c.Slide, c.IndexA, c.IndexB, c.Statistic);
        }
    }

    /// <summary>A new empty sink with the same settings, for one worker thread.</summary>
    TSelf CreatePart();

    /// <summary>Adds everything a part received into this sink.</summary>
    void Merge(TSelf part);
}
