namespace EventReview.Core.Plots;

/// <summary>
/// A drawing primitive in pixel coordinates (origin top left, y down), what both back ends draw: the figure lowered by
/// <see cref="PlotLayout"/>. Coordinates are rounded to 0.01 px so that the SVG text holds them exactly.
/// </summary>
public abstract record PlotMark;
