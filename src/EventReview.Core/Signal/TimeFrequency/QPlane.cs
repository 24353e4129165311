namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>One plane of constant quality factor Q with its frequency rows, lowest first.</summary>
public sealed record QPlane(double Q, IReadOnlyList<QRow> Rows);
