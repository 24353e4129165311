namespace EventReview.Core.Plots;

/// <summary>A short note at (<paramref name="X"/>, <paramref name="Y"/>) in data coordinates, left-aligned there.</summary>
public sealed record PlotText(double X, double Y, string Text) : PlotElement;
