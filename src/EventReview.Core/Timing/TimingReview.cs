using System.Globalization;
using EventReview.Core.Antenna;
using EventReview.Core.Network;
using EventReview.Core.Verdicts;
using EventReview.Core.Formatting;

namespace EventReview.Core.Timing;

/// <summary>
/// The timing check kind in one call, for the app and the CLI alike: the cross-site timing check with its sky-fit chi-square
/// (<see cref="TimingCheck"/>) and, when an observed sign and amplitude ratio are given, the antenna-response test of that pair
/// on the directions the timing allows (<see cref="AntennaCheck"/>); one judgement of both, a summary line and the sky map.
/// </summary>
public static class TimingReview
{
    /// <summary>Runs the check kind.</summary>
    /// <param name="sites">The network's sites (at least those with an arrival).</param>
    /// <param name="arrivals">Arrivals, in the order pairs are formed (a before b).</param>
    /// <param name="parameters">k, false-alarm probability and the optional antenna observation.</param>
    /// <exception cref="ArgumentException">When a parameter is out of range or the inputs are unusable (message names what).</exception>
    public static TimingReviewResult Run(IReadOnlyList<Site> sites, IReadOnlyList<SiteArrival> arrivals, TimingCheckParameters parameters)
    {
        ArgumentNullException.ThrowIfNull(sites);
        ArgumentNullException.ThrowIfNull(arrivals);
        ArgumentNullException.ThrowIfNull(parameters);
        parameters.Validate();
        var timing = TimingCheck.Run(sites, arrivals, new TimingOptions(parameters.KSigma, null, parameters.FalseAlarmProbability));
        AntennaConsistencyResult? antenna = null;
        IReadOnlyList<SkyCell>? cells = null;
        if (parameters.HasObservation)
        {
            var observation = new AntennaObservation(parameters.ObservedSign!.Value, parameters.ObservedAmplitudeRatio!.Value);
            var options = new AntennaConsistencyOptions(parameters.RatioTolerance);
            antenna = AntennaCheck.ForPair(sites, timing, parameters.PairA!, parameters.PairB!, observation, options);
            var a = sites.First(s => string.Equals(s.Code, parameters.PairA, StringComparison.OrdinalIgnoreCase));
            var b = sites.First(s => string.Equals(s.Code, parameters.PairB, StringComparison.OrdinalIgnoreCase));
            cells = AntennaSkyRegion.AllowedCells(a, b, observation, timing.GmstDegrees, 5, options);
        }

        var used = sites.Where(s => arrivals.Any(x => string.Equals(x.SiteCode.Trim(), s.Code, StringComparison.OrdinalIgnoreCase))).ToList();
        var judgement = Judge(timing, antenna);
        return new TimingReviewResult(timing, antenna, judgement)
        {
            Summary = Summarise(timing, antenna),
            PictureSvg = Plots.PlotSvg.Write(Plots.Figures.SkyMapFigure.Build(used, timing, cells)) + Evidence.CheckRecords.PictureSeparator
                + Plots.PlotSvg.Write(Plots.Figures.NetworkMapFigure.Build(used)),
        };
    }

    private static Judgement Judge(TimingCheckResult timing, AntennaConsistencyResult? antenna)
    {
        var timingPart = timing.Judgement!;
        if (antenna is null)
        {
            return timingPart;
        }

        var ci = CultureInfo.InvariantCulture;
        var allowed = antenna.FractionAllowingSignAndRatio > 0;
        var antennaText = string.Create(ci,
            $"antenna response {antenna.A}/{antenna.B}: sign {(antenna.ObservedSign > 0 ? "+1" : "−1")} and ratio {antenna.ObservedAmplitudeRatio:0.##} (±{antenna.RatioTolerance:P0}) allowed on {antenna.FractionAllowingSignAndRatio:P0} of the {antenna.DirectionCount} directions the timing allows");
        if (timingPart.Verdict != Verdict.Consistent)
        {
            return new Judgement(timingPart.Verdict, timingPart.Reason + "; " + antennaText);
        }

        return allowed
            ? new Judgement(Verdict.Consistent, timingPart.Reason + "; " + antennaText)
            : new Judgement(Verdict.Inconsistent, antennaText + " (no direction reproduces the observed sign and ratio); " + timingPart.Reason);
    }

    /// <summary>One line with the key numbers, units and the rule they were judged against.</summary>
    public static string Summarise(TimingCheckResult timing, AntennaConsistencyResult? antenna)
    {
        ArgumentNullException.ThrowIfNull(timing);
        var ci = CultureInfo.InvariantCulture;
        var worst = timing.Pairs.OrderBy(x => x.MarginSeconds).First();
        var text = string.Create(ci,
            $"{timing.Pairs.Count(x => x.Consistent)} of {timing.Pairs.Count} pairs within window; tightest {worst.A}-{worst.B}: observed {worst.ObservedSeconds * 1e3:+0.00;-0.00} ms (allowed ±{worst.AllowedSeconds * 1e3:F2} ms: light-travel {worst.LightTravelSeconds * 1e3:F2} ms + {timing.KSigma:0.#}σ timing).");
        if (timing.DegreesOfFreedom is > 0 && timing.Chi2 is { } chi2 && timing.PValue is { } p)
        {
            text += string.Create(ci, $" Sky fit χ² = {chi2:0.##}, {timing.DegreesOfFreedom} dof, p = {ScientificFormat.Format(p, 2)}.");
        }
        else if (timing.DegreesOfFreedom == 0)
        {
            text += timing.RingsMeet == true ? " Three sites: no residual test possible (0 dof)." : string.Create(ci, $" Three sites, rings do not meet: χ² = {timing.Chi2:0.##}.");
        }

        if (antenna is not null)
        {
            text += string.Create(ci,
                $" Antenna response {antenna.A}/{antenna.B}: sign {(antenna.ObservedSign > 0 ? "+" : "−")}, ratio {antenna.ObservedAmplitudeRatio:0.##} allowed on {antenna.FractionAllowingSignAndRatio:P0} of the directions.");
        }

        return text;
    }
}
