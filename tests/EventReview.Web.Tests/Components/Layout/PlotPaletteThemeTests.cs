using EventReview.Core.Plots;
using EventReview.Web.Components.Layout;

namespace EventReview.Web.Tests.Components.Layout;

/// <summary>The pictures and the app share one palette: the plot model's colours are the theme's.</summary>
public class PlotPaletteThemeTests
{
    [Fact]
    public void The_plot_palette_uses_the_theme_colours()
    {
        var light = ReviewTheme.Theme.PaletteLight;
        Assert.Equal(PlotPalette.Ink, light.Primary.ToString(MudBlazor.Utilities.MudColorOutputFormats.Hex), ignoreCase: true);
        Assert.Equal(PlotPalette.Warm, light.Secondary.ToString(MudBlazor.Utilities.MudColorOutputFormats.Hex), ignoreCase: true);
        Assert.Equal(PlotPalette.Green, light.Tertiary.ToString(MudBlazor.Utilities.MudColorOutputFormats.Hex), ignoreCase: true);
        Assert.Equal(PlotPalette.Steel, light.Info.ToString(MudBlazor.Utilities.MudColorOutputFormats.Hex), ignoreCase: true);
        Assert.Equal(PlotPalette.Alarm, light.Error.ToString(MudBlazor.Utilities.MudColorOutputFormats.Hex), ignoreCase: true);
        Assert.Equal(PlotPalette.Paper, light.Background.ToString(MudBlazor.Utilities.MudColorOutputFormats.Hex), ignoreCase: true);
        Assert.Equal(PlotPalette.Text, light.TextPrimary.ToString(MudBlazor.Utilities.MudColorOutputFormats.Hex), ignoreCase: true);
    }
}
