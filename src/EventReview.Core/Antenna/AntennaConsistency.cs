using EventReview.Core.Geodesy;
using EventReview.Core.Network;

namespace EventReview.Core.Antenna;

/// <summary>
/// Judges an observed relative sign and amplitude ratio between two sites against their antenna patterns over a
/// set of candidate directions, polarisation angles ψ and binary inclinations ι.
/// <para>Model (leading-order quadrupole emission of a circular binary): h+ ∝ A+ cos Φ(t), h× ∝ A× sin Φ(t), with
/// A+ = (1 + cos²ι)/2 and A× = cos ι. A site sees h = Re[z e^{-iΦ}] with z = F+ A+ + i F× A×, so its amplitude
/// is |z| and its phase arg z. The amplitude ratio is |z_b| / |z_a|. The relative sign is that of
/// Re(z_b conj(z_a)) = F+b F+a A+² + F×b F×a A×², i.e. of the zero-lag correlation of the two waveforms, which is
/// what an overlap check that allows a sign flip reports (the dominant-phase term). Samples where |z_a| &lt; 1e-6
/// (site a blind) are skipped. Between neighbouring ψ samples the ratio is taken as continuous (intermediate values count).</para>
/// </summary>
public static class AntennaConsistency
{
    /// <summary>The model text stored with every result.</summary>
    public const string ModelDescription =
        "h+ ∝ (1+cos²ι)/2 cos Φ, h× ∝ cos ι sin Φ; site amplitude |F+ A+ + i F× A×|; relative sign = sign of F+a F+b A+² + F×a F×b A×² (zero-lag correlation)";

    /// <summary>Evaluates the observation for directions n (ECEF, toward the source) between site a and site b.</summary>
    /// <exception cref="ArgumentException">When the sign is not ±1, the ratio is not finite and positive, or no direction is given.</exception>
    public static AntennaConsistencyResult Evaluate(Site a, Site b, IReadOnlyList<Vector3> directions, AntennaObservation observation,
        AntennaConsistencyOptions? options = null)
    {
        ArgumentNullException.ThrowIfNull(a);
        ArgumentNullException.ThrowIfNull(b);
        ArgumentNullException.ThrowIfNull(directions);
        ArgumentNullException.ThrowIfNull(observation);
        options ??= AntennaConsistencyOptions.Default;
        Validate(observation, options);
        if (directions.Count == 0)
        {
            throw new ArgumentException("At least one direction is needed.", nameof(directions));
        }

        var tensorA = SiteGeometry.Tensor(a);
        var tensorB = SiteGeometry.Tensor(b);
        var min = double.PositiveInfinity;
        var max = 0.0;
        int signCount = 0, ratioCount = 0, bothCount = 0;
        var allowed = new bool[directions.Count];
        for (var k = 0; k < directions.Count; k++)
        {
            var s = Scan(tensorA, tensorB, directions[k], observation, options);
            min = Math.Min(min, s.MinRatio);
            max = Math.Max(max, s.MaxRatio);
            signCount += s.Sign ? 1 : 0;
            ratioCount += s.Ratio ? 1 : 0;
            bothCount += s.Both ? 1 : 0;
            allowed[k] = s.Both;
        }

        var n = (double)directions.Count;
        var verdict = bothCount > 0 ? "consistent" : "inconsistent";
        return new AntennaConsistencyResult(a.Code, b.Code, observation.Sign, observation.AmplitudeRatio, options.RatioTolerance,
            directions.Count, double.IsFinite(min) ? min : 0, max, signCount / n, ratioCount / n, bothCount / n, allowed, verdict,
            ModelDescription,
            [
                $"ψ sampled at {options.PsiSamples} angles in [0°, 180°); |cos ι| at {options.InclinationSamples} values in [0, 1]",
                $"ratio matches when within a factor {1 + options.RatioTolerance:0.###} of the observed ratio",
                "detectors as long-wavelength L-shaped interferometers with horizontal arms; equal calibration at both sites",
            ]);
    }

    /// <summary>True when some sampled (ψ, ι) at direction n gives the observed sign and a ratio within tolerance.</summary>
    public static bool Allows(double[,] tensorA, double[,] tensorB, Vector3 direction, AntennaObservation observation, AntennaConsistencyOptions? options = null)
    {
        options ??= AntennaConsistencyOptions.Default;
        Validate(observation, options);
        return Scan(tensorA, tensorB, direction, observation, options).Both;
    }

    private static DirectionScan Scan(double[,] tensorA, double[,] tensorB, Vector3 direction, AntennaObservation observation, AntennaConsistencyOptions options)
    {
        var a0 = AntennaPattern.Response(tensorA, direction, 0);
        var b0 = AntennaPattern.Response(tensorB, direction, 0);
        var low = observation.AmplitudeRatio / (1 + options.RatioTolerance);
        var high = observation.AmplitudeRatio * (1 + options.RatioTolerance);
        var scan = new DirectionScan { MinRatio = double.PositiveInfinity };
        var ratios = new double[options.PsiSamples];
        var signs = new int[options.PsiSamples];
        for (var j = 0; j < options.InclinationSamples; j++)
        {
            var cosIota = options.InclinationSamples == 1 ? 1.0 : j / (double)(options.InclinationSamples - 1);
            var aPlus = 0.5 * (1 + (cosIota * cosIota));
            var aCross = cosIota;
            for (var i = 0; i < options.PsiSamples; i++)
            {
                var psi = Math.PI * i / options.PsiSamples;
                var fa = a0.RotatePolarisation(psi);
                var fb = b0.RotatePolarisation(psi);
                var ampA = Math.Sqrt(Square(fa.FPlus * aPlus) + Square(fa.FCross * aCross));
                var ampB = Math.Sqrt(Square(fb.FPlus * aPlus) + Square(fb.FCross * aCross));
                var correlation = (fa.FPlus * fb.FPlus * aPlus * aPlus) + (fa.FCross * fb.FCross * aCross * aCross);
                ratios[i] = ampA < 1e-6 ? double.NaN : ampB / ampA;
                signs[i] = ampA < 1e-6 ? 0 : Math.Sign(correlation);
                if (double.IsNaN(ratios[i]))
                {
                    continue;
                }

                scan.MinRatio = Math.Min(scan.MinRatio, ratios[i]);
                scan.MaxRatio = Math.Max(scan.MaxRatio, ratios[i]);
                scan.Sign |= signs[i] == observation.Sign;
                scan.Ratio |= ratios[i] >= low && ratios[i] <= high;
            }

            // Between neighbouring ψ samples (period 180°) the ratio is continuous: a crossing of [low, high] by two
            // samples of the observed sign counts as a match even when neither sample lies inside.
            for (var i = 0; i < options.PsiSamples; i++)
            {
                var next = (i + 1) % options.PsiSamples;
                if (double.IsNaN(ratios[i]) || double.IsNaN(ratios[next]))
                {
                    continue;
                }

                var lo = Math.Min(ratios[i], ratios[next]);
                var hi = Math.Max(ratios[i], ratios[next]);
                var overlaps = hi >= low && lo <= high;
                scan.Ratio |= overlaps;
                scan.Both |= overlaps && signs[i] == observation.Sign && signs[next] == observation.Sign;
            }
        }

        return scan;
    }

    private static void Validate(AntennaObservation observation, AntennaConsistencyOptions options)
    {
        if (observation.Sign is not (1 or -1))
        {
            throw new ArgumentException("Observed sign must be +1 or -1.", nameof(observation));
        }

        if (!double.IsFinite(observation.AmplitudeRatio) || observation.AmplitudeRatio <= 0)
        {
            throw new ArgumentException("Observed amplitude ratio must be a finite number > 0.", nameof(observation));
        }

        if (!double.IsFinite(options.RatioTolerance) || options.RatioTolerance < 0 || options.PsiSamples < 1 || options.InclinationSamples < 1)
        {
            throw new ArgumentException("Ratio tolerance must be ≥ 0 and sample counts ≥ 1.", nameof(options));
        }
    }

    private static double Square(double x) => x * x;

    private struct DirectionScan
    {
        public double MinRatio;
        public double MaxRatio;
        public bool Sign;
        public bool Ratio;
        public bool Both;
    }
}
