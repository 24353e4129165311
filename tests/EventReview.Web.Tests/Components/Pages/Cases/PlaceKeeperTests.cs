using Bunit;
using Microsoft.AspNetCore.Components;
using EventReview.Web.Components.Pages.Cases;

namespace EventReview.Web.Tests.Components.Pages.Cases;

public sealed class PlaceKeeperTests : MudTestContext
{
    private readonly BunitJSModuleInterop _module;

    public PlaceKeeperTests()
    {
        SetRendererInfo(new RendererInfo("Server", isInteractive: true));
        _module = JSInterop.SetupModule("./js/checklist-places.js");
        _module.SetupVoid("settle", _ => true);
    }

    private IReadOnlyList<IReadOnlyList<object?>> Settled() => _module.Invocations["settle"].Select(i => i.Arguments).ToList();

    [Fact]
    public void Each_new_place_is_settled_once_with_the_item_and_how_it_was_reached()
    {
        var cut = Render<PlaceKeeper>(p => p.Add(x => x.ItemKey, "alpha.one").Add(x => x.Tab, 1).Add(x => x.How, "address"));

        cut.Render(p => p.Add(x => x.ItemKey, "alpha.one").Add(x => x.Tab, 1).Add(x => x.How, "address"));
        Assert.Equal([["alpha.one", "address"]], Settled());

        cut.Render(p => p.Add(x => x.ItemKey, "alpha.two").Add(x => x.Tab, 1).Add(x => x.How, "keyboard"));
        cut.Render(p => p.Add(x => x.ItemKey, null).Add(x => x.Tab, 2).Add(x => x.How, "address"));
        Assert.Equal([["alpha.one", "address"], ["alpha.two", "keyboard"], [null, "address"]], Settled());
    }

    [Fact]
    public void A_prerendered_page_calls_no_script()
    {
        SetRendererInfo(new RendererInfo("Static", isInteractive: false));

        Render<PlaceKeeper>(p => p.Add(x => x.ItemKey, "alpha.one").Add(x => x.Tab, 1));

        Assert.Empty(JSInterop.Invocations);
    }
}
