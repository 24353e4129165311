namespace EventReview.Core.Timing;

/// <summary>
/// The timing check of one pair of sites. Seconds and metres throughout. <see cref="ObservedSeconds"/> = arrival(b) - arrival(a);
/// <see cref="AllowedSeconds"/> = light-travel + k × <see cref="CombinedSigmaSeconds"/>; <see cref="MarginSeconds"/> = allowed - |observed|
/// (negative when inconsistent). <see cref="RingCosine"/> = c × observed / baseline; <see cref="RingAngleDegrees"/> is the angle between
/// the source direction and r_a - r_b, or null when |<see cref="RingCosine"/>| &gt; 1 (outside the light-travel window: no ring).
/// </summary>
public sealed record PairTiming(
    string A,
    string B,
    double BaselineMeters,
    double LightTravelSeconds,
    double CombinedSigmaSeconds,
    double AllowedSeconds,
    double ObservedSeconds,
    double MarginSeconds,
    bool Consistent,
    double RingCosine,
    double? RingAngleDegrees,
    string Rule);
