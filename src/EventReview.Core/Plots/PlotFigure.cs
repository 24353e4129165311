namespace EventReview.Core.Plots;

/// <summary>
/// A retained description of one figure: axes, elements, an optional colour bar (required when a
/// <see cref="PlotHeatMap"/> is present) and a one-line caption saying what to look for. Turned into marks by
/// <see cref="PlotLayout"/> and written by <see cref="PlotSvg"/> (app, records, index.html) or by the PDF back end of
/// the dossier; the same figure always gives the same bytes.
/// </summary>
/// <param name="Caption">One sentence: what the figure shows and what to look for.</param>
/// <param name="X">Horizontal axis.</param>
/// <param name="Y">Vertical axis.</param>
/// <param name="Elements">Drawn in order (later on top).</param>
public sealed record PlotFigure(string Caption, PlotAxis X, PlotAxis Y, IReadOnlyList<PlotElement> Elements)
{
    /// <summary>Colour scale of the figure's maps, drawn as a bar on the right.</summary>
    public ColourScale? ColourBar { get; init; }

    /// <summary>Width (px).</summary>
    public int Width { get; init; } = 760;

    /// <summary>Height (px).</summary>
    public int Height { get; init; } = 420;

    /// <summary>Keep one data unit equal along both axes (maps).</summary>
    public bool EqualAspect { get; init; }

    /// <summary>Where the legend goes: true for the top right corner of the axes, false for top left.</summary>
    public bool LegendRight { get; init; }

    /// <summary>Prefer the bottom corners for the legend (maps whose top holds most of what matters).</summary>
    public bool LegendBottom { get; init; }
}
