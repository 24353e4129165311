namespace EventReview.Core.Plots;

/// <summary>A filled dot of radius <paramref name="Radius"/> (px).</summary>
public sealed record DotMark(PlotPoint Centre, double Radius, string Colour) : PlotMark;
