namespace EventReview.Core.Signal.Pictures;

/// <summary>
/// The colours of the pictures Core draws, taken from the app's own theme (ink blue, warm accent, green, paper): one place to change
/// them. The web theme (<c>ReviewTheme</c>) uses the same values.
/// </summary>
internal static class PicturePalette
{
    /// <summary>Deep ink blue: the first series, the strongest colour-scale end.</summary>
    public const string Ink = "#1f3a68";

    /// <summary>Warm accent: the second series, marks that need attention.</summary>
    public const string Warm = "#a4561c";

    /// <summary>Muted green: a third series, fitted tracks.</summary>
    public const string Green = "#3d6b5a";

    /// <summary>Paper: the weakest colour-scale end.</summary>
    public const string Paper = "#faf8f3";

    /// <summary>Light shading of a window or region.</summary>
    public const string Shade = "#e9edf4";

    /// <summary>Neutral grey for zero lines and secondary marks.</summary>
    public const string Grey = "#8a8f99";
}
