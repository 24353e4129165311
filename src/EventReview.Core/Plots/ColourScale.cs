namespace EventReview.Core.Plots;

/// <summary>
/// A map's colour scale: values from <paramref name="Min"/> (paper) to <paramref name="Max"/> (ink), linear, clamped
/// at both ends; drawn as a colour bar labelled with <paramref name="Label"/> (with its unit) beside every map.
/// </summary>
/// <param name="Label">What the colour means, with unit.</param>
/// <param name="Min">Value shown as paper.</param>
/// <param name="Max">Value shown as ink (values above are clamped; say so in <paramref name="Note"/>).</param>
/// <param name="Note">Second line under the bar, e.g. "capped at the 99.5th percentile".</param>
public sealed record ColourScale(string Label, double Min, double Max, string? Note = null)
{
    /// <summary>Number of distinct shades drawn.</summary>
    public const int Shades = 24;

    /// <summary>The shade index 0..<see cref="Shades"/> of <paramref name="value"/> (0 for NaN or at/below Min).</summary>
    public int Shade(double value)
    {
        if (double.IsNaN(value) || Max <= Min)
        {
            return 0;
        }

        return (int)Math.Round(Math.Clamp((value - Min) / (Max - Min), 0, 1) * Shades);
    }

    /// <summary>The colour of shade <paramref name="shade"/>.</summary>
    public static string Colour(int shade) => PlotPalette.Ramp(shade / (double)Shades);
}
