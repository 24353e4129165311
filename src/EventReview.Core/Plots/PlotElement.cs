namespace EventReview.Core.Plots;

/// <summary>
/// Something drawn inside a figure's axes, in data coordinates. Elements with a <see cref="Label"/> appear in the legend,
/// in the order given.
/// </summary>
public abstract record PlotElement
{
    /// <summary>Legend text (with unit or meaning), or null to leave the element out of the legend.</summary>
    public string? Label { get; init; }

    /// <summary>Colour of the element (one of <see cref="PlotPalette"/>'s).</summary>
    public string Colour { get; init; } = PlotPalette.Ink;
}
