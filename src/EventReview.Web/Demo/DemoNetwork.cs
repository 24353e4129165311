using EventReview.Core.Network;

namespace EventReview.Web.Demo;

/// <summary>An invented three-site network: names, codes, positions and orientations of our own (positions on land).</summary>
public static class DemoNetwork
{
    public const string Name = "Demo network (invented)";

    public static IReadOnlyList<Site> Sites() =>
    [
        new("KP", "Kestrel Plain", -22.0, 17.5, 1150.0, 35.0, 125.0, 1.0e-4),
        new("AB", "Ardent Basin", 15.0, 19.0, 320.0, 310.0, 40.0, 1.5e-4),
        new("SM", "Sollen Mesa", 40.0, -3.5, 690.0, 80.0, 170.0, 1.2e-4),
    ];
}
