namespace EventReview.Web.Services;

/// <summary>Whether this start runs the invented demo (seeded data and the demo accounts panel on sign-in).</summary>
public sealed record DemoMode(bool Enabled);
