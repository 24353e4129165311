namespace EventReview.Core.Plots;

/// <summary>A filled polygon with fill opacity <paramref name="Opacity"/> (0..1).</summary>
public sealed record AreaMark(IReadOnlyList<PlotPoint> Points, string Colour, double Opacity) : PlotMark;
