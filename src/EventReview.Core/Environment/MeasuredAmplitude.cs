namespace EventReview.Core.Environment;

/// <summary>An amplitude read from data, with how it was read.</summary>
/// <param name="Value">The amplitude (strain, or sensor units).</param>
/// <param name="Description">What was measured, over which band and span, in words.</param>
public sealed record MeasuredAmplitude(double Value, string Description);
