using EventReview.Core.Signal.Chirps;

namespace EventReview.Core.Signal.Simulation;

/// <summary>
/// Leading-order inspiral polarisations with unit amplitude scale: h+ = A (1 + cos²ι)/2 cos Φ, h× = A cos ι sin Φ with
/// A = (f / 100 Hz)^{2/3}, f and Φ from <see cref="Chirp.FrequencyAt"/> and <see cref="Chirp.PhaseAt"/>. After the
/// cut-off frequency a damped sinusoid at the cut-off frequency continues the phase (a crude merger-ringdown taper).
/// Multiply by a strain scale for physical units.
/// </summary>
// Leading-order inspiral waveform: Cutler and Flanagan, Phys. Rev. D 49 (1994) 2658, eqs. 2-3 (quadrupole amplitude ∝ f^{2/3}).
public static class ChirpWaveform
{
    /// <summary>
    /// Samples the polarisations at t_i = startOffsetSeconds + i / fs, where times are measured from coalescence
    /// (negative before it). Samples before the low-frequency start are zero.
    /// </summary>
    /// <returns>h+ and h× arrays of <paramref name="count"/> samples (dimensionless, unit amplitude scale).</returns>
    public static (double[] Plus, double[] Cross) Generate(ChirpParameters p, double sampleRateHz, int count, double startOffsetSeconds)
    {
        ArgumentNullException.ThrowIfNull(p);
        if (!(p.ChirpMassMsun > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(p), p.ChirpMassMsun, "Chirp mass must be positive (solar masses).");
        }

        double fCut = p.CutoffFrequencyHz ?? Chirp.EqualMassIscoFrequency(p.ChirpMassMsun);
        if (!(fCut > p.LowFrequencyHz))
        {
            throw new ArgumentOutOfRangeException(nameof(p), fCut, "Cut-off frequency must be above the low frequency (Hz).");
        }

        double tauStart = Chirp.TimeToCoalescence(p.ChirpMassMsun, p.LowFrequencyHz);
        double tauCut = Chirp.TimeToCoalescence(p.ChirpMassMsun, fCut);
        double phaseCut = Chirp.PhaseAt(p.ChirpMassMsun, tauCut);
        double ampCut = Math.Pow(fCut / 100, 2.0 / 3);
        double taperSeconds = 5 / p.LowFrequencyHz;
        double decay = p.RingdownCycles / fCut;
        double ci = Math.Cos(p.InclinationRad);
        double plusFactor = (1 + (ci * ci)) / 2;
        var hp = new double[count];
        var hc = new double[count];
        for (int i = 0; i < count; i++)
        {
            double t = startOffsetSeconds + (i / sampleRateHz);
            double tau = -t;
            double amp, phase;
            if (tau > tauStart)
            {
                continue;
            }

            if (tau > tauCut)
            {
                double f = Chirp.FrequencyAt(p.ChirpMassMsun, tau);
                amp = Math.Pow(f / 100, 2.0 / 3);
                phase = Chirp.PhaseAt(p.ChirpMassMsun, tau);
                double sinceStart = tauStart - tau;
                if (sinceStart < taperSeconds)
                {
                    amp *= 0.5 - (0.5 * Math.Cos(Math.PI * sinceStart / taperSeconds));
                }
            }
            else
            {
                double dt = tauCut - tau;
                if (dt > 20 * decay)
                {
                    continue;
                }

                amp = ampCut * Math.Exp(-dt / decay);
                phase = phaseCut + (2 * Math.PI * fCut * dt);
            }

            // PhaseAt increases with t (dΦ/dt = 2π f > 0), and the ringdown continues it at 2π f_cut.
            double ph = p.PhaseRad + phase;
            hp[i] = amp * plusFactor * Math.Cos(ph);
            hc[i] = amp * ci * Math.Sin(ph);
        }

        return (hp, hc);
    }
}
