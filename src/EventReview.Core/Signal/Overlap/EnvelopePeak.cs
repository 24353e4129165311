using EventReview.Core.Signal.Spectra;

namespace EventReview.Core.Signal.Overlap;

/// <summary>
/// The peak of the correlation envelope L(k) = |Z(k)| and its one-sigma uncertainty. A Gaussian, ln L ≈ α + b j + c j², is fitted by
/// least squares over j = −h..h around the peak, h being where the envelope first drops below 80 % of its peak (at least 2 samples):
/// the fit spans the peak's width, so the fast ripples that noise adds to |Z| average out. The peak lies at δ = −b / (2c).
/// Its uncertainty is σ_δ = sqrt(Var b) / (2 |c|): the curvature c is read from the data, Var b is measured on the data's own noise.
/// With a = s + n_a and b = s' + n_b, the noise of ln L(j) is Re(conj(u_j) δZ(j)) / |Z(j)| with u_j = Z(j)/|Z(j)|, made of s·n_b (T1), n_a·s' (T2)
/// and n_a·n_b (T3). Off-source windows give them: on-source A against off-source B measures T1 + T3, off-source A against
/// on-source B measures T2 + T3, two off-source windows measure T3, so Var b = (T1 + T3) + (T2 + T3) − T3 (never below T3).
/// At high SNR this is the Cramér–Rao form 1 / (2π Δf_rms ρ) of the standard signal-detection texts (from memory; Δf_rms the
/// signal's rms bandwidth about its mean frequency, since the phase is estimated too). Assumes stationary noise and a resolved peak.
/// </summary>
internal static class EnvelopePeak
{
    /// <summary>Fewest off-source windows for a variance estimate (relative error of σ about 1 / sqrt(2 × 8) = 25 %).</summary>
    public const int MinimumWindows = 8;

    /// <summary>Relative curvature noise above which the peak counts as barely resolved (our choice, from simulated pairs).</summary>
    public const double ResolvedLimit = 0.3;



    /// <summary>The fit: the peak lies <paramref name="Delta"/> samples from index <paramref name="Centre"/> (within ±h); c is the curvature of ln L.</summary>
    public readonly record struct Fit(int Centre, double Delta, double Curvature, int HalfWidth);

    /// <summary>
    /// Fits ln L(j) = α + b j + c j² (a Gaussian through the envelope, which follows a band-limited peak more closely than a parabola)
    /// over j = −h..h, recentred once on the fitted peak so that the window does not follow the noise of the whole-sample maximum;
    /// null when the peak is closer than 2 samples to an end, not curved, or the envelope is zero.
    /// </summary>
    public static Fit? Locate(IReadOnlyList<double> magnitude, int best)
    {
        int last = magnitude.Count - 1;
        int left = 0, right = 0;
        double level = 0.8 * magnitude[best];
        while (best - left - 1 >= 0 && magnitude[best - left - 1] >= level)
        {
            left++;
        }

        while (best + right + 1 <= last && magnitude[best + right + 1] >= level)
        {
            right++;
        }

        int h = Math.Max(2, Math.Min(left + 1, right + 1));
        int centre = best;
        Fit? fit = null;
        for (int pass = 0; pass < 4; pass++)
        {
            if (centre - h < 0 || centre + h > last)
            {
                h = Math.Min(centre, last - centre);
                if (h < 2)
                {
                    return null;
                }
            }

            fit = FitAt(magnitude, centre, h);
            if (fit is not { } f)
            {
                return null;
            }

            // Recentre on the fitted peak, and take the half-width where the fitted Gaussian falls to 80 % (ln 1.25 below the top):
            // both follow the fit rather than the noise of single samples.
            int nextCentre = centre + (int)Math.Round(f.Delta);
            int nextH = Math.Max(2, (int)Math.Round(Math.Sqrt(Math.Log(1.25) / -f.Curvature)));
            if (nextCentre == centre && nextH == h)
            {
                break;
            }

            (centre, h) = (nextCentre, nextH);
        }

        return fit;
    }

    private static Fit? FitAt(IReadOnlyList<double> magnitude, int centre, int h)
    {
        double s2 = 0, s4 = 0, sy = 0, sjy = 0, sj2y = 0;
        for (int j = -h; j <= h; j++)
        {
            if (!(magnitude[centre + j] > 0))
            {
                return null;
            }

            double y = Math.Log(magnitude[centre + j]);
            s2 += j * j;
            s4 += (double)j * j * j * j;
            sy += y;
            sjy += j * y;
            sj2y += j * j * y;
        }

        int n = (2 * h) + 1;
        double slope = sjy / s2;
        double curvature = (sj2y - (s2 * sy / n)) / (s4 - (s2 * s2 / n));
        return curvature < 0 ? new Fit(centre, Math.Clamp(-slope / (2 * curvature), -h, h), curvature, h) : null;
    }

    /// <summary>
    /// The spread of the fitted peak: σ of its position in samples, the relative one-sigma noise of the fitted curvature, and σ of
    /// the phase arg Z at the peak in radians (its own noise plus the lag's error times the phase's turn per sample), all from the
    /// same three-term measurement; null when too few off-source windows exist. A curvature noise above about 30 % means the
    /// peak is barely resolved: the linear error propagation then understates the lag's scatter.
    /// </summary>
    /// <param name="a">Analytic A.</param>
    /// <param name="b">Analytic B.</param>
    /// <param name="grid">Indices of the comparison.</param>
    /// <param name="fit">The fit (its centre is an index into <paramref name="re"/> and <paramref name="im"/>).</param>
    /// <param name="re">Re Z at every searched shift (index = shift + maxLag), unnormalised.</param>
    /// <param name="im">Im Z likewise.</param>
    public static (double Sigma, double CurvatureNoise, double PhaseSigma)? Spread(AnalyticSeries a, AnalyticSeries b, OverlapGrid grid, Fit fit, double[] re, double[] im)
    {
        var positions = grid.NoisePositions;
        if (positions.Count < MinimumWindows)
        {
            return null;
        }

        // The noise of ln L(j) = ln |Z(j)| is Re(conj(Z_j) δZ_j) / |Z_j|², that of arg Z_j is Im(conj(Z_j) δZ_j) / |Z_j|²: the phase of
        // Z turns with the shift (about 2π f / fs per sample), so each shift is projected on its own direction.
        int h = fit.HalfWidth, bestK = fit.Centre - grid.MaxLag;
        var ur = new double[(2 * h) + 1];
        var ui = new double[(2 * h) + 1];
        for (int j = -h; j <= h; j++)
        {
            int i = fit.Centre + j;
            double norm2 = (re[i] * re[i]) + (im[i] * im[i]);
            (ur[j + h], ui[j + h]) = norm2 > 0 ? (re[i] / norm2, im[i] / norm2) : (0, 0);
        }

        double turn = Math.IEEERemainder(Math.Atan2(im[fit.Centre + 1], re[fit.Centre + 1]) - Math.Atan2(im[fit.Centre - 1], re[fit.Centre - 1]), 2 * Math.PI) / 2;
        int w = grid.Window, aOn = grid.AStart, bOn = grid.AStart + grid.Offset;
        double s2 = 0, s4 = 0;
        for (int j = -h; j <= h; j++)
        {
            s2 += j * j;
            s4 += (double)j * j * j * j;
        }

        int n = (2 * h) + 1;
        double cDen = s4 - (s2 * s2 / n);

        // The fit's slope b = Σ j y_j / Σ j² and curvature c = Σ (j² − Σj²/n) y_j / (Σj⁴ − (Σj²)²/n) are linear in y_j = ln L(j), so
        // their noise is the same sums over the noise of y_j; the peak moves by −δb / (2c), the phase by turn × that plus its own noise.
        double[] Noise(int aBase, int bBase)
        {
            double sb = 0, sc = 0, phase = 0;
            for (int j = -h; j <= h; j++)
            {
                var (zr, zi) = ComplexCorrelation.At(a, aBase, b, bBase, bestK + j, w);
                double y = (ur[j + h] * zr) + (ui[j + h] * zi);
                sb += j * y;
                sc += ((j * j) - (s2 / n)) * y;
                phase = j == 0 ? (ur[h] * zi) - (ui[h] * zr) : phase;
            }

            double shift = -(sb / s2) / (2 * fit.Curvature);
            return [shift, sc / cDen, (turn * shift) + phase];
        }

        var x = new double[3];
        var y = new double[3];
        var v = new double[3];
        for (int m = 0; m < positions.Count; m++)
        {
            Accumulate(x, Noise(aOn, positions[m] + grid.Offset));
            Accumulate(y, Noise(positions[m], bOn));
            Accumulate(v, Noise(positions[m], positions[(m + 1) % positions.Count] + grid.Offset));
        }

        // Var = (T1 + T3) + (T2 + T3) − T3, never below T3.
        double Sd(int k) => Math.Sqrt(Math.Max(x[k] + y[k] - v[k], v[k]) / positions.Count);
        return (Sd(0), Sd(1) / -fit.Curvature, Sd(2));
    }

    private static void Accumulate(double[] sums, double[] values)
    {
        for (int k = 0; k < sums.Length; k++)
        {
            sums[k] += values[k] * values[k];
        }
    }
}
