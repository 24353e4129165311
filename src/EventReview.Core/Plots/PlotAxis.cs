namespace EventReview.Core.Plots;

/// <summary>
/// One axis: its label with the unit in parentheses (the style requires a unit on every drawn axis, "dimensionless"
/// included), its range and scale.
/// </summary>
/// <param name="Label">Axis label with unit, e.g. "time from candidate (ms)".</param>
/// <param name="Min">Lower end of the range (positive for <see cref="AxisScale.Log"/>).</param>
/// <param name="Max">Upper end; a range of zero width is widened by ±0.5 (linear) or ×/÷ 2 (log).</param>
/// <param name="Scale">Linear, log or hidden.</param>
public sealed record PlotAxis(string Label, double Min, double Max, AxisScale Scale = AxisScale.Linear)
{
    /// <summary>
    /// Names of rows 0, 1, 2, ... for a vertical axis of categories (channels, sites): ticks at the whole numbers with these
    /// names instead of numbers; the axis room grows with the longest name. Null for a numeric axis.
    /// </summary>
    public IReadOnlyList<string>? Categories { get; init; }

    /// <summary>Fixed tick step in data units (30 for degrees on a map), or null for the automatic 1-2-5 steps.</summary>
    public double? TickStep { get; init; }

    /// <summary>The ticks of this (linear) axis: multiples of <see cref="TickStep"/> when set, otherwise <see cref="PlotTicks.Linear"/>.</summary>
    public IReadOnlyList<double> LinearTicks(int target)
    {
        var (lo, hi) = Range();
        if (TickStep is not { } step || !(step > 0))
        {
            return PlotTicks.Linear(lo, hi, target);
        }

        var ticks = new List<double>();
        for (long k = (long)Math.Ceiling((lo / step) - 1e-9); k * step <= hi + (step * 1e-9) && ticks.Count < 200; k++)
        {
            ticks.Add(k * step);
        }

        return ticks;
    }

    /// <summary>The range actually drawn: ordered, widened when empty, positive for a log axis.</summary>
    public (double Lo, double Hi) Range()
    {
        double lo = Math.Min(Min, Max), hi = Math.Max(Min, Max);
        if (Scale == AxisScale.Log)
        {
            lo = lo > 0 ? lo : (hi > 0 ? hi / 100 : 1);
            hi = hi > lo ? hi : lo * 2;
            return (lo, hi);
        }

        return hi > lo ? (lo, hi) : (lo - 0.5, hi + 0.5);
    }

    /// <summary>Where <paramref name="value"/> falls along the axis, 0 at the low end and 1 at the high end (NaN if unplottable).</summary>
    public double Fraction(double value)
    {
        var (lo, hi) = Range();
        if (Scale == AxisScale.Log)
        {
            return value > 0 ? Math.Log(value / lo) / Math.Log(hi / lo) : double.NaN;
        }

        return (value - lo) / (hi - lo);
    }
}
