namespace EventReview.Core.Significance;

/// <summary>How the background coincidences are found; both give identical coincidence lists.</summary>
public enum TimeSlideAlgorithm
{
    /// <summary>One pass over triggers bucketed by time block and phase modulo the step (see <see cref="FastTimeSlides"/>).</summary>
    Fast,

    /// <summary>Shift and merge for every slide in turn (see <see cref="NaiveTimeSlides"/>); slides x triggers work.</summary>
    Naive,
}
