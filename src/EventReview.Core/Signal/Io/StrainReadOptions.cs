namespace EventReview.Core.Signal.Io;

/// <summary>Validation settings for strain imports.</summary>
/// <param name="MinimumSamples">Fewest data lines accepted (default 16).</param>
/// <param name="StepTolerance">Largest accepted relative deviation of any time step from the mean step (default 0.01 = 1 %).</param>
/// <param name="SnapSampleRate">When true (default) a sample rate within 1e-5 relative of a whole number of Hz is rounded to it,
/// since text files round their time stamps.</param>
public sealed record StrainReadOptions(int MinimumSamples = 16, double StepTolerance = 0.01, bool SnapSampleRate = true);
