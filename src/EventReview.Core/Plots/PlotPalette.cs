namespace EventReview.Core.Plots;

/// <summary>
/// Every colour the pictures use (SVG in the app, the dossier and the command line; the dossier's native PDF drawing),
/// defined once and taken from the app's own theme: the web theme (<c>ReviewTheme</c> in the web project) reads its
/// palette from these constants, so the pictures and the pages always match. Series colours are chosen to stay apart for
/// the common colour-vision deficiencies (ink blue against warm brown, green as the third) and every series also differs
/// by dash or mark, so no meaning rests on colour alone. Text is at least <see cref="MinimumTextPx"/> px. No picture
/// spells a colour of its own; add a constant here instead.
/// </summary>
public static class PlotPalette
{
    /// <summary>Smallest text size in the pictures (px at 1:1).</summary>
    public const double MinimumTextPx = 12;

    /// <summary>Deep ink blue (theme primary): the first series and the strong end of the colour scale.</summary>
    public const string Ink = "#1f3a68";

    /// <summary>Warm accent (theme secondary): the second series, the candidate, marks that need attention.</summary>
    public const string Warm = "#a4561c";

    /// <summary>Muted green (theme tertiary): a third series, fitted tracks, bands that pass.</summary>
    public const string Green = "#3d6b5a";

    /// <summary>Slate blue (theme info): a fourth series, data-quality segments.</summary>
    public const string Steel = "#2f5d8a";

    /// <summary>Brick red (theme error): limits that fail, an excursion above its threshold.</summary>
    public const string Alarm = "#a32626";

    /// <summary>Amber (theme warning): thresholds to compare against.</summary>
    public const string Amber = "#b86a12";

    /// <summary>Paper (theme background): the weak end of the colour scale.</summary>
    public const string Paper = "#faf8f3";

    /// <summary>White (theme surface): the picture's background.</summary>
    public const string Surface = "#ffffff";

    /// <summary>Light shading of a window, region or band.</summary>
    public const string Shade = "#dfe5ef";

    /// <summary>Land on a map of the Earth.</summary>
    public const string Land = "#e8e3d6";

    /// <summary>Neutral grey: zero lines, graticules, secondary marks, what does not count (a channel shown safe).</summary>
    public const string Grey = "#8a8f99";

    /// <summary>Light rule (theme table lines): grid lines.</summary>
    public const string Rule = "#e6e1d6";

    /// <summary>Stronger rule (theme lines): frames of secondary panels.</summary>
    public const string RuleStrong = "#ddd8cc";

    /// <summary>Body text (theme text primary): labels, axes, frames.</summary>
    public const string Text = "#1c2330";

    /// <summary>Secondary text (theme text secondary).</summary>
    public const string TextSoft = "#4b5566";

    /// <summary>Series colours in order of use.</summary>
    public static IReadOnlyList<string> Series { get; } = [Ink, Warm, Green, Steel];

    /// <summary>The colour-scale colour at <paramref name="level"/> (0 = paper, 1 = ink; clamped), linear in RGB.</summary>
    public static string Ramp(double level)
    {
        double s = double.IsNaN(level) ? 0 : Math.Clamp(level, 0, 1);
        (int R, int G, int B) paper = (0xfa, 0xf8, 0xf3), ink = (0x1f, 0x3a, 0x68);
        int Mix(int a, int b) => (int)Math.Round(a + ((b - a) * s));
        return string.Create(System.Globalization.CultureInfo.InvariantCulture,
            $"#{Mix(paper.R, ink.R):x2}{Mix(paper.G, ink.G):x2}{Mix(paper.B, ink.B):x2}");
    }
}
