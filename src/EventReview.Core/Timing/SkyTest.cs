using System.Globalization;
using EventReview.Core.Statistics;
using EventReview.Core.Formatting;

namespace EventReview.Core.Timing;

/// <summary>The chi-square test of the best sky direction of three or more sites, with its sentence for the reader.</summary>
internal sealed record SkyTest(SkyFit Fit, int DegreesOfFreedom, double? PValue, bool IsBound, bool Passes, string Note)
{
    public static SkyTest Of(int siteCount, SkyFit fit, double fap)
    {
        var ci = CultureInfo.InvariantCulture;
        var chi2 = fit.MinimalChiSquare;
        var dof = siteCount - 3;
        var mirror = fit.Solutions.Count > 1 ? "; the sites are nearly coplanar, so a mirror direction fits equally well" : string.Empty;
        if (dof >= 1)
        {
            var p = ChiSquare.UpperTail(chi2, dof);
            var passes = p >= fap;
            var note = string.Create(ci,
                $"best sky direction over {siteCount} sites: χ² = {chi2:0.##} with {dof} degree{(dof == 1 ? string.Empty : "s")} of freedom, p = {ScientificFormat.Format(p, 3)} {(passes ? "≥" : "<")} {ScientificFormat.Format(fap, 3)}")
                + (passes ? string.Empty : ": no single direction fits the arrivals within the sites' timing uncertainties") + mirror;
            return new SkyTest(fit, dof, p, false, passes, note);
        }

        if (fit.RingsMeet)
        {
            return new SkyTest(fit, 0, null, false, true,
                "three sites: the rings meet in two mirror-image directions (reflections through the plane of the sites); 0 degrees of freedom, so no residual test is possible");
        }

        var bound = ChiSquare.UpperTail(chi2, 1);
        var ok = bound >= fap;
        return new SkyTest(fit, 0, bound, true, ok, string.Create(ci,
            $"three sites whose rings do not meet: the closest direction leaves χ² = {chi2:0.##} (RMS {fit.MinimalResidualSeconds * 1e3:0.000###} ms); 0 degrees of freedom, so no residual test proper; judged with 1 degree of freedom instead (a conservative p-value), p = {ScientificFormat.Format(bound, 3)} {(ok ? "≥" : "<")} {ScientificFormat.Format(fap, 3)}"));
    }
}
