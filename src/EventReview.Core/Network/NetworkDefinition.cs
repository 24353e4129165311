namespace EventReview.Core.Network;

/// <summary>A named network of validated sites, as read from or written to a network file.</summary>
public sealed record NetworkDefinition(string Name, IReadOnlyList<Site> Sites);
