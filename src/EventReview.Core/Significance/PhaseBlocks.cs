namespace EventReview.Core.Significance;

/// <summary>
/// Triggers laid out for the fast finder: grouped into blocks of consecutive slot numbers
/// (slot = floor(y / step)), and sorted by phase (y - slot x step, in [0, step)) within each block.
/// Structure of arrays, all in that order.
/// </summary>
internal sealed class PhaseBlocks
{
    private PhaseBlocks(int n, int blocks)
    {
        Phase = new long[n];
        Slot = new long[n];
        Index = new int[n];
        SnrSquared = new double[n];
        ChirpMass = new double[n];
        BlockIds = new long[blocks];
        BlockStarts = new int[blocks + 1];
    }

    public long[] Phase { get; }

    public long[] Slot { get; }

    public int[] Index { get; }

    public double[] SnrSquared { get; }

    public double[] ChirpMass { get; }

    /// <summary>Block number (floor(slot / blockSlots)) of each non-empty block, ascending.</summary>
    public long[] BlockIds { get; }

    /// <summary>Start of each block in the arrays; the last entry is the total count.</summary>
    public int[] BlockStarts { get; }

    /// <summary>Lays out positions y (ascending) with their trigger indices and per-trigger values.</summary>
    public static PhaseBlocks Build(long[] y, int[] index, double[] snrSquared, double[] chirpMass, long stepNs, long blockSlots)
    {
        var n = y.Length;
        var slots = new long[n];
        var phases = new long[n];
        var blockCount = 0;
        long lastBlock = long.MinValue;
        for (var i = 0; i < n; i++)
        {
            var slot = RingOverlap.FloorDiv(y[i], stepNs);
            slots[i] = slot;
            phases[i] = y[i] - (slot * stepNs);
            var block = RingOverlap.FloorDiv(slot, blockSlots);
            if (block != lastBlock)
            {
                blockCount++;
                lastBlock = block;
            }
        }

        var layout = new PhaseBlocks(n, blockCount);
        var perm = new int[n];
        for (var i = 0; i < n; i++)
        {
            perm[i] = i;
        }

        var b = -1;
        lastBlock = long.MinValue;
        for (var i = 0; i < n; i++)
        {
            var block = RingOverlap.FloorDiv(slots[i], blockSlots);
            if (block != lastBlock)
            {
                b++;
                layout.BlockIds[b] = block;
                layout.BlockStarts[b] = i;
                lastBlock = block;
            }
        }

        layout.BlockStarts[blockCount] = n;
        Parallel.For(0, blockCount, k =>
        {
            var start = layout.BlockStarts[k];
            Array.Sort(phases, perm, start, layout.BlockStarts[k + 1] - start);
        });

        for (var i = 0; i < n; i++)
        {
            var src = perm[i];
            layout.Phase[i] = phases[i];
            layout.Slot[i] = slots[src];
            layout.Index[i] = index[src];
            layout.SnrSquared[i] = snrSquared[index[src]];
            layout.ChirpMass[i] = chirpMass[index[src]];
        }

        return layout;
    }

    /// <summary>First block position whose id is &gt;= the given id (BlockIds.Length when none).</summary>
    public int FirstBlockAtOrAfter(long id)
    {
        var pos = Array.BinarySearch(BlockIds, id);
        return pos >= 0 ? pos : ~pos;
    }
}
