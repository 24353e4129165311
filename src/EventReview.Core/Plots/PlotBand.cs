namespace EventReview.Core.Plots;

/// <summary>
/// A shaded band between <paramref name="Lower"/> and <paramref name="Upper"/> over <paramref name="Xs"/> (a window,
/// a ±threshold band, an uncertainty band). Two x values with equal bounds make a rectangle.
/// </summary>
public sealed record PlotBand(IReadOnlyList<double> Xs, IReadOnlyList<double> Lower, IReadOnlyList<double> Upper) : PlotElement
{
    /// <summary>Fill opacity, 0..1.</summary>
    public double Opacity { get; init; } = 1;

    /// <summary>A rectangle from (<paramref name="x0"/>, <paramref name="y0"/>) to (<paramref name="x1"/>, <paramref name="y1"/>).</summary>
    public static PlotBand Rectangle(double x0, double x1, double y0, double y1) => new([x0, x1], [y0, y0], [y1, y1]);
}
