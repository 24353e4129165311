namespace EventReview.Core.Plots;

/// <summary>
/// A map of values on a grid: cell (i, j) is centred on (<paramref name="XCentres"/>[i], <paramref name="YCentres"/>[j])
/// and holds <paramref name="Values"/>[i][j]; cell edges are half-way between centres (geometrically on a log axis).
/// Shaded by the figure's <see cref="PlotFigure.ColourBar"/>; cells at shade 0 are left blank. Drawn in at most
/// <see cref="MaxColumns"/> × <see cref="MaxRows"/> blocks, each the largest value it covers, so a short peak is never
/// averaged away.
/// </summary>
public sealed record PlotHeatMap(IReadOnlyList<double> XCentres, IReadOnlyList<double> YCentres, IReadOnlyList<IReadOnlyList<double>> Values) : PlotElement
{
    /// <summary>Most blocks across.</summary>
    public const int MaxColumns = 120;

    /// <summary>Most blocks up.</summary>
    public const int MaxRows = 60;
}
