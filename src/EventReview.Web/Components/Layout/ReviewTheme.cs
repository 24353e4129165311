using MudBlazor;

namespace EventReview.Web.Components.Layout;

/// <summary>Our palette, defined once: paper-tinted page, deep ink-blue primary, warm accent for "needs attention".</summary>
public static class ReviewTheme
{
    public static MudTheme Theme { get; } = new()
    {
        PaletteLight = new PaletteLight
        {
            Primary = "#1f3a68",
            Secondary = "#a4561c",
            Tertiary = "#3d6b5a",
            Warning = "#b86a12",
            Error = "#a32626",
            Success = "#2e6b3a",
            Info = "#2f5d8a",
            Background = "#faf8f3",
            Surface = "#ffffff",
            AppbarBackground = "#1f3a68",
            DrawerBackground = "#f3f0e8",
            TextPrimary = "#1c2330",
            TextSecondary = "#4b5566",
            LinesDefault = "#ddd8cc",
            TableLines = "#e6e1d6",
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
