using Bunit;
using EventReview.Core.Plots;
using EventReview.Web.Components.Shared;
using Microsoft.AspNetCore.Components.Web;
using MudBlazor;

namespace EventReview.Web.Tests.Components.Shared;

public sealed class PictureFrameTests : MudDialogTestContext
{
    private static readonly string Svg = PlotSvg.Write(new PlotFigure("Sample caption: look for the line", new PlotAxis("time (s)", 0, 1),
        new PlotAxis("strain (dimensionless)", -1, 1), [new PlotLine([0, 1], [0, 0.5]) { Label = "site KX" }]));

    [Fact]
    public void The_picture_is_shown_with_a_button_that_opens_it_full_width_titled_by_its_caption()
    {
        var provider = Render<MudDialogProvider>();
        var frame = Render<PictureFrame>(p => p.Add(x => x.Svg, Svg));
        Assert.Single(frame.FindAll("figure.picture > svg[data-plot]"));

        frame.Find("button.picture-open").Click();

        provider.WaitForElement("#picture-zoom-view");
        Assert.Contains("Sample caption: look for the line", provider.Markup, StringComparison.Ordinal);
        Assert.Contains("width:min(100%, ", provider.Find(".picture-zoom-inner").GetAttribute("style"), StringComparison.Ordinal);
    }

    [Fact]
    public void Buttons_and_keys_zoom_in_and_out_within_limits_and_0_fits_again()
    {
        var provider = Render<MudDialogProvider>();
        var frame = Render<PictureFrame>(p => p.Add(x => x.Svg, Svg));
        frame.Find("button.picture-open").Click();
        provider.WaitForElement("#picture-zoom-view");
        string Width() => provider.Find(".picture-zoom-inner").GetAttribute("style")!.Split(',')[0];

        provider.Find("#picture-zoom-in").Click();
        Assert.Equal("width:min(125%", Width());
        provider.Find("#picture-zoom-view").KeyDown(new KeyboardEventArgs { Key = "+" });
        Assert.Equal("width:min(156%", Width());
        provider.Find("#picture-zoom-view").KeyDown(new KeyboardEventArgs { Key = "0" });
        Assert.Equal("width:min(100%", Width());
        provider.Find("#picture-zoom-view").KeyDown(new KeyboardEventArgs { Key = "-" });
        Assert.Equal("width:min(100%", Width()); // never smaller than the fitted picture
        for (int k = 0; k < 20; k++)
        {
            provider.Find("#picture-zoom-view").KeyDown(new KeyboardEventArgs { Key = "+" });
        }

        Assert.Equal("width:min(800%", Width()); // at most 8 times
    }

    [Fact]
    public void Close_closes_the_dialog()
    {
        var provider = Render<MudDialogProvider>();
        var frame = Render<PictureFrame>(p => p.Add(x => x.Svg, Svg));
        frame.Find("button.picture-open").Click();
        provider.WaitForElement("#picture-close").Click();
        Assert.Empty(provider.FindAll("#picture-zoom-view"));
    }

    [Fact]
    public void An_older_picture_without_a_caption_gets_a_plain_title_and_a_plain_width()
    {
        Assert.Equal("width:150%", PictureTitle.Width("<svg xmlns=\"http://www.w3.org/2000/svg\"/>", 1.5));
        Assert.Equal("width:min(100%, 126.7vh)", PictureTitle.Width(Svg, 1)); // 760 × 420 px: 70 vh high is 126.7 vh wide
        Assert.Equal("Picture", PictureTitle.Of("<svg xmlns=\"http://www.w3.org/2000/svg\"><text>old</text></svg>"));
        Assert.Equal("Picture", PictureTitle.Of("not svg at all <"));
        Assert.Equal("Sample caption: look for the line", PictureTitle.Of(Svg));
    }
}
