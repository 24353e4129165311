using EventReview.Core.Pictures;

namespace EventReview.Core.Plots;

/// <summary>
/// The plot style's colours, in one place: the same values as the app's MudBlazor theme (<c>ReviewTheme</c> in the web
/// project, which reads them from here). Series colours are chosen to stay apart for the common colour-vision
/// deficiencies (ink blue against warm brown, green as the third) and every series also differs by dash or mark, so no
/// meaning rests on colour alone. Text is at least <see cref="MinimumTextPx"/> px.
/// </summary>
public static class PlotPalette
{
    /// <summary>Smallest text size in the pictures (px at 1:1).</summary>
    public const double MinimumTextPx = 12;

    /// <summary>Deep ink blue (theme primary): the first series and the strong end of the colour scale.</summary>
    public const string Ink = PicturePalette.Ink;

    /// <summary>Warm accent (theme secondary): the second series and marks that need attention.</summary>
    public const string Warm = PicturePalette.Warm;

    /// <summary>Muted green (theme tertiary): a third series, fitted tracks, bands that pass.</summary>
    public const string Green = PicturePalette.Green;

    /// <summary>Steel blue (theme info): a fourth series.</summary>
    public const string Steel = PicturePalette.Slate;

    /// <summary>Signal red (theme error): limits that fail.</summary>
    public const string Alarm = PicturePalette.Brick;

    /// <summary>Paper (theme background): the weak end of the colour scale.</summary>
    public const string Paper = PicturePalette.Paper;

    /// <summary>Light shading of a window, region or band.</summary>
    public const string Shade = PicturePalette.ShadeStrong;

    /// <summary>Neutral grey: zero lines, graticules, secondary marks.</summary>
    public const string Grey = PicturePalette.Grey;

    /// <summary>Body text (theme text primary).</summary>
    public const string Text = PicturePalette.Text;

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
