namespace EventReview.Core.Pictures;

/// <summary>
/// Every colour the pictures Core draws (SVG in the app, the dossier and the command line), defined once and taken from the app's
/// own theme: paper-tinted page, deep ink-blue primary, warm accent for what needs attention, muted green, and their light tints.
/// The web theme (<c>ReviewTheme</c> in the web project) takes its palette from these constants, so the pictures and the pages
/// always match. No picture writer spells a colour of its own; add a constant here instead.
/// </summary>
public static class PicturePalette
{
    /// <summary>Deep ink blue (theme primary): the first series, the strongest end of a colour scale.</summary>
    public const string Ink = "#1f3a68";

    /// <summary>Warm accent (theme secondary): the second series, marks that need attention, the candidate.</summary>
    public const string Warm = "#a4561c";

    /// <summary>Muted green (theme tertiary): a third series, fitted tracks, uncertainty bands.</summary>
    public const string Green = "#3d6b5a";

    /// <summary>Brick red (theme error): a failed limit, an excursion above its threshold.</summary>
    public const string Brick = "#a32626";

    /// <summary>Amber (theme warning): a fourth series, thresholds to compare against.</summary>
    public const string Amber = "#b86a12";

    /// <summary>Slate blue (theme info): a fifth series, data-quality segments.</summary>
    public const string Slate = "#2f5d8a";

    /// <summary>Dark text (theme text primary): labels, axes, frames, recorded data.</summary>
    public const string Text = "#1c2330";

    /// <summary>Secondary text (theme text secondary): axis numbers and captions.</summary>
    public const string TextSoft = "#4b5566";

    /// <summary>Neutral grey for zero lines, secondary marks and what does not count (for example a channel shown safe).</summary>
    public const string Grey = "#8a8f99";

    /// <summary>Paper (theme background): the weakest end of a colour scale, a map's land or plot area.</summary>
    public const string Paper = "#faf8f3";

    /// <summary>White (theme surface): the picture's background.</summary>
    public const string Surface = "#ffffff";

    /// <summary>Light rule (theme table lines): grid lines.</summary>
    public const string Rule = "#e6e1d6";

    /// <summary>Stronger rule (theme lines): frames of secondary panels, grid lines on paper.</summary>
    public const string RuleStrong = "#ddd8cc";

    /// <summary>Light ink tint: shading of a window or searched region.</summary>
    public const string Shade = "#e9edf4";

    /// <summary>A deeper ink tint: the bands and regions of the plot-model figures (<c>Plots/PlotPalette.Shade</c>).</summary>
    public const string ShadeStrong = "#dfe5ef";

    /// <summary>Light warm tint: shading of the on-source window or of allowed directions.</summary>
    public const string WarmTint = "#f6e6d6";

    /// <summary>
    /// Colours of successive series (rings of a sky map, curves of one plot), in order: ink, warm, green, brick, slate, amber.
    /// Repeat from the start when there are more series; every series also carries a label.
    /// </summary>
    public static IReadOnlyList<string> Series { get; } = [Ink, Warm, Green, Brick, Slate, Amber];

    /// <summary>The colour a <paramref name="fraction"/> of the way from <paramref name="from"/> to <paramref name="to"/>, linearly in
    /// RGB (0 gives <paramref name="from"/>, 1 gives <paramref name="to"/>; clamped to [0, 1]); both as <c>#rrggbb</c>.</summary>
    public static string Mix(string from, string to, double fraction)
    {
        ArgumentNullException.ThrowIfNull(from);
        ArgumentNullException.ThrowIfNull(to);
        double s = double.IsNaN(fraction) ? 0 : Math.Clamp(fraction, 0, 1);
        int Channel(int i)
        {
            int a = Convert.ToInt32(from.Substring(1 + (2 * i), 2), 16), b = Convert.ToInt32(to.Substring(1 + (2 * i), 2), 16);
            return (int)Math.Round(a + ((b - a) * s));
        }

        return string.Create(System.Globalization.CultureInfo.InvariantCulture, $"#{Channel(0):x2}{Channel(1):x2}{Channel(2):x2}");
    }
}
