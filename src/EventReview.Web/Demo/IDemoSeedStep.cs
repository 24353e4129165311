namespace EventReview.Web.Demo;

/// <summary>An extra part of the demo (simulated data for one check), run after the demo cases exist, in <see cref="Order"/>.</summary>
public interface IDemoSeedStep
{
    int Order { get; }

    Task SeedAsync(DemoContext demo, CancellationToken ct);
}
