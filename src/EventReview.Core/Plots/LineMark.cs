namespace EventReview.Core.Plots;

/// <summary>An open polyline of stroke width <paramref name="Width"/> (px).</summary>
public sealed record LineMark(IReadOnlyList<PlotPoint> Points, string Colour, double Width, bool Dashed) : PlotMark;
