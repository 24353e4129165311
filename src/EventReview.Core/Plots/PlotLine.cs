namespace EventReview.Core.Plots;

/// <summary>A polyline through (<paramref name="Xs"/>[k], <paramref name="Ys"/>[k]); NaN values break the line.</summary>
public sealed record PlotLine(IReadOnlyList<double> Xs, IReadOnlyList<double> Ys) : PlotElement
{
    /// <summary>Stroke width (px).</summary>
    public double Width { get; init; } = 1.5;

    /// <summary>Dashed (the second way, besides colour, to tell series apart).</summary>
    public bool Dashed { get; init; }
}
