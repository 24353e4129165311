using System.Text.RegularExpressions;
using Bunit;
using Microsoft.Extensions.DependencyInjection;
using MudBlazor.Services;

namespace EventReview.Web.Tests.Components;

/// <summary>A bUnit context with MudBlazor services, zero transitions and loose JS interop.</summary>
public abstract partial class MudTestContext : BunitContext
{
    protected MudTestContext()
    {
        Services.AddMudServices(o =>
        {
            o.SnackbarConfiguration.ShowTransitionDuration = 0;
            o.SnackbarConfiguration.HideTransitionDuration = 0;
        });
        JSInterop.Mode = JSRuntimeMode.Loose;
    }

    /// <summary>The path outlines ("d" attributes) of an icon: what makes one icon different from another.</summary>
    protected static IReadOnlyList<string> PathsOf(string svgMarkup) =>
        PathData().Matches(svgMarkup).Select(m => m.Groups["d"].Value).Where(d => d != "M0 0h24v24H0z" && d != "M0 0h24v24H0V0z").ToList();

    [GeneratedRegex("\\bd=\"(?<d>[^\"]+)\"")]
    private static partial Regex PathData();
}
