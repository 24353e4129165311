using EventReview.Core.Cases;

namespace EventReview.Core.Tests.Builders;

/// <summary>Invented actors used across the domain tests.</summary>
public static class People
{
    public static Actor Coordinator { get; } = new("u-coord", "Coordinator Cole");

    public static Actor ReviewerA { get; } = new("u-rev-a", "Reviewer Ada");

    public static Actor ReviewerB { get; } = new("u-rev-b", "Reviewer Bo");

    public static Actor ReviewerC { get; } = new("u-rev-c", "Reviewer Cy");
}
