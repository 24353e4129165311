namespace EventReview.Core.Plots;

/// <summary>A laid-out figure: its size (px), caption and marks in drawing order.</summary>
public sealed record PlotDrawing(int Width, int Height, string Caption, IReadOnlyList<PlotMark> Marks);
