using EventReview.Core.Plots;
using MudBlazor;

namespace EventReview.Web.Components.Layout;

/// <summary>
/// Our palette: paper-tinted page, deep ink-blue primary, warm accent for "needs attention". The light palette's colours come from
/// Core's <see cref="PlotPalette"/> (one place for the pictures and the pages); <c>wwwroot/app.css</c> uses the same values.
/// </summary>
public static class ReviewTheme
{
    public static MudTheme Theme { get; } = new()
    {
        PaletteLight = new PaletteLight
        {
            Primary = PlotPalette.Ink,
            Secondary = PlotPalette.Warm,
            Tertiary = PlotPalette.Green,
            Warning = PlotPalette.Amber,
            Error = PlotPalette.Alarm,
            Success = "#2e6b3a",
            Info = PlotPalette.Steel,
            Background = PlotPalette.Paper,
            Surface = PlotPalette.Surface,
            AppbarBackground = PlotPalette.Ink,
            DrawerBackground = "#f3f0e8",
            TextPrimary = PlotPalette.Text,
            TextSecondary = PlotPalette.TextSoft,
            LinesDefault = PlotPalette.RuleStrong,
            TableLines = PlotPalette.Rule,
        },
        PaletteDark = new PaletteDark
        {
            Primary = "#8fb0e8",
            Secondary = "#e0a064",
            Background = "#161b24",
            Surface = "#1e2430",
            AppbarBackground = "#1b2a44",
            DrawerBackground = "#1a202b",
        },
        Typography = new Typography
        {
            Default = new DefaultTypography
            {
                FontFamily = ["DejaVu Sans", "Segoe UI", "Helvetica Neue", "Arial", "sans-serif"],
                LineHeight = "1.6",
            },
        },
    };
}
