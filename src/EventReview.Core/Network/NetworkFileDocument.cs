namespace EventReview.Core.Network;

/// <summary>The network file: <c>{"name": "...", "sites": [...]}</c> (camelCase JSON; azimuths clockwise from true north, degrees; height metres; uncertainty seconds).</summary>
public sealed record NetworkFileDocument(string? Name, IReadOnlyList<NetworkFileSite?>? Sites);
