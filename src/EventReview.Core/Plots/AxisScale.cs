namespace EventReview.Core.Plots;

/// <summary>How an axis maps values to positions.</summary>
public enum AxisScale
{
    /// <summary>Linear, with ticks at 1, 2 or 5 × 10^k steps.</summary>
    Linear,

    /// <summary>Base-10 logarithmic (values must be positive), ticks at decades (and 2, 5 within short spans).</summary>
    Log,

    /// <summary>Not drawn: map-like figures whose coordinates carry no unit (projected sky or globe).</summary>
    Hidden,
}
