namespace EventReview.Web.Components.Shared;

/// <summary>The title of a stored picture: its caption when it is a plot-model SVG, otherwise a plain word.</summary>
public static class PictureTitle
{
    /// <summary>The caption of <paramref name="svg"/>, or "Picture" for an older picture without one.</summary>
    public static string Of(string svg) => Core.Plots.PlotSvg.Read(svg)?.Caption is { Length: > 0 } caption ? caption : "Picture";
}
