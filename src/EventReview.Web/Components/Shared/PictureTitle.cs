namespace EventReview.Web.Components.Shared;

/// <summary>The title of a stored picture: its caption when it is a plot-model SVG, otherwise a plain word.</summary>
public static class PictureTitle
{
    /// <summary>The caption of <paramref name="svg"/>, or "Picture" for an older picture without one.</summary>
    public static string Of(string svg) => Core.Plots.PlotSvg.Read(svg)?.Caption is { Length: > 0 } caption ? caption : "Picture";

    /// <summary>
    /// The CSS width of the picture at <paramref name="zoom"/> (1 = fitted): the dialog's width times the zoom, and for a
    /// plot-model picture at most what keeps its whole height within 70 % of the window's height times the zoom.
    /// </summary>
    public static string Width(string svg, double zoom)
    {
        var d = Core.Plots.PlotSvg.Read(svg);
        string percent = (zoom * 100).ToString("0", System.Globalization.CultureInfo.InvariantCulture) + "%";
        return d is { Width: > 0, Height: > 0 }
            ? "width:min(" + percent + ", " + (zoom * 70 * d.Width / d.Height).ToString("0.#", System.Globalization.CultureInfo.InvariantCulture) + "vh)"
            : "width:" + percent;
    }
}
