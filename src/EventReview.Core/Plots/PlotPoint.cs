namespace EventReview.Core.Plots;

/// <summary>A point in pixels (origin top left, y down).</summary>
public readonly record struct PlotPoint(double X, double Y)
{
    /// <summary>The point rounded to 0.01 px.</summary>
    public static PlotPoint Of(double x, double y) => new(Math.Round(x, 2), Math.Round(y, 2));
}
