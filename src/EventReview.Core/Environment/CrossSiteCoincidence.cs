namespace EventReview.Core.Environment;

/// <summary>Two hits of the same kind at different sites within the light-travel window (local noise rarely does this; global magnetic noise can).</summary>
/// <param name="Kind">Shared sensor kind.</param>
/// <param name="SiteA">First site (alphabetical).</param>
/// <param name="ChannelA">Channel at the first site.</param>
/// <param name="SiteB">Second site.</param>
/// <param name="ChannelB">Channel at the second site.</param>
/// <param name="SeparationSeconds">Trigger time at B minus trigger time at A, seconds.</param>
public sealed record CrossSiteCoincidence(string Kind, string SiteA, string ChannelA, string SiteB, string ChannelB, double SeparationSeconds);
