namespace EventReview.Core.Plots;

/// <summary>Dots at (<paramref name="Xs"/>[k], <paramref name="Ys"/>[k]); points outside the axes are not drawn.</summary>
public sealed record PlotPoints(IReadOnlyList<double> Xs, IReadOnlyList<double> Ys) : PlotElement
{
    /// <summary>Dot radius (px).</summary>
    public double Radius { get; init; } = 2.5;
}
