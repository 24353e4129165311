namespace EventReview.Core.Plots;

/// <summary>A filled polygon through (<paramref name="Xs"/>[k], <paramref name="Ys"/>[k]) in data coordinates (sky regions, ring widths).</summary>
public sealed record PlotPolygon(IReadOnlyList<double> Xs, IReadOnlyList<double> Ys) : PlotElement
{
    /// <summary>Fill opacity, 0..1.</summary>
    public double Opacity { get; init; } = 1;
}
