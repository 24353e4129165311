namespace EventReview.Core.Plots;

/// <summary>
/// A line of text of <paramref name="Size"/> px with its baseline at <paramref name="At"/>; <paramref name="Anchor"/> is
/// "start", "middle" or "end"; <paramref name="Rotated"/> turns it 90° anticlockwise about <paramref name="At"/>.
/// </summary>
public sealed record TextMark(PlotPoint At, string Text, double Size, string Colour, string Anchor, bool Rotated, bool Italic) : PlotMark;
