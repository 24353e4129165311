using EventReview.Core.Time;

namespace EventReview.Core.Signal.Simulation;

/// <summary>Simulates strain at several sites: coloured Gaussian noise, a projected chirp, glitches and lines.</summary>
public static class NetworkSimulator
{
    /// <summary>
    /// For each site: h = F+ h+(t − delay) + F× h×(t − delay) (unit-scale <see cref="ChirpWaveform"/>), scaled so that the
    /// network optimal SNR sqrt(Σ ρ_i²) equals <see cref="SimulationOptions.NetworkSnr"/> against the ASD (from 10 Hz), or by
    /// <see cref="SimulationOptions.AmplitudeStrain"/>; then noise (one System.Random(seed) drawn site by site, in order),
    /// glitches and lines are added. Antenna responses and delays come from the caller.
    /// </summary>
    /// <exception cref="ArgumentException">When no site is given, codes repeat, or a glitch names an unknown site.</exception>
    public static SimulationResult Simulate(IReadOnlyList<SiteProjection> sites, SimulationOptions options)
    {
        ArgumentNullException.ThrowIfNull(sites);
        ArgumentNullException.ThrowIfNull(options);
        if (sites.Count == 0 || sites.Select(s => s.Code).Distinct().Count() != sites.Count)
        {
            throw new ArgumentException("At least one site, with distinct codes, is needed.", nameof(sites));
        }

        var unknown = (options.Glitches ?? []).FirstOrDefault(g => sites.All(s => s.Code != g.SiteCode));
        if (unknown is not null)
        {
            throw new ArgumentException($"Glitch names site '{unknown.SiteCode}', which is not simulated.", nameof(options));
        }

        double fs = options.SampleRateHz;
        int n = (int)Math.Round(options.DurationSeconds * fs);
        if (n < 64)
        {
            throw new ArgumentOutOfRangeException(nameof(options), options.DurationSeconds, "Duration must give at least 64 samples.");
        }

        var asd = options.Asd ?? new AsdShape();
        var tc = options.Coalescence ?? options.Start.AddSeconds(options.DurationSeconds / 2);
        var signals = new double[sites.Count][];
        var unitSnr = new double[sites.Count];
        for (int s = 0; s < sites.Count; s++)
        {
            signals[s] = new double[n];
            if (options.Chirp is { } chirp)
            {
                double startOffset = options.Start.SecondsSince(tc) - sites[s].DelaySeconds;
                var (hp, hc) = ChirpWaveform.Generate(chirp, fs, n, startOffset);
                for (int i = 0; i < n; i++)
                {
                    signals[s][i] = (sites[s].FPlus * hp[i]) + (sites[s].FCross * hc[i]);
                }

                unitSnr[s] = SignalToNoise.Optimal(signals[s], fs, asd.Evaluate, 10);
            }
        }

        double unitNetwork = Math.Sqrt(unitSnr.Sum(v => v * v));
        double scale = options.NetworkSnr is { } target && unitNetwork > 0 ? target / unitNetwork : options.AmplitudeStrain;
        var rng = new Random(options.Seed);
        var result = new List<SiteStrain>();
        var truths = new List<SiteTruth>();
        double ci = Math.Cos(options.Chirp?.InclinationRad ?? 0);
        double firstOffset = 0;
        for (int s = 0; s < sites.Count; s++)
        {
            var data = new double[n];
            double peak = 0;
            for (int i = 0; i < n; i++)
            {
                data[i] = signals[s][i] * scale;
                peak = Math.Max(peak, Math.Abs(data[i]));
            }

            if (options.AddNoise)
            {
                var noise = NoiseSimulator.Generate(asd.Evaluate, fs, n, rng);
                for (int i = 0; i < n; i++)
                {
                    data[i] += noise[i];
                }
            }

            AddExtras(data, sites[s].Code, options, fs);
            var site = sites[s];
            double a = site.FPlus * (1 + (ci * ci)) / 2, b = site.FCross * ci;
            double offset = Math.Atan2(b, a);
            if (s == 0)
            {
                firstOffset = offset;
            }

            truths.Add(new SiteTruth(
                site.Code, tc.AddSeconds(site.DelaySeconds).ToString(), site.DelaySeconds, site.FPlus, site.FCross,
                Math.Sqrt((a * a) + (b * b)), offset, Math.Cos(offset - firstOffset) >= 0 ? 1 : -1, unitSnr[s] * scale, peak));
            result.Add(new SiteStrain(site.Code, new TimeSeries(options.Start, fs, data)));
        }

        var assumptions = new List<string>
        {
            "leading-order (Newtonian) inspiral, amplitude ∝ f^(2/3), phase from the leading-order frequency evolution; crude damped-sinusoid ringdown after the cut-off",
            "site waveform = F+ h+(t - delay) + Fx hx(t - delay) with delays and responses supplied by the caller",
            "SNR = optimal matched-filter SNR of the injected signal against the model ASD from 10 Hz (noise realisation not included)",
            "noise: stationary Gaussian, generated in the frequency domain from the model ASD; deterministic for the seed",
        };
        return new SimulationResult(result, new SimulationTruth(
            options.Seed, options.Chirp?.ChirpMassMsun, options.Chirp is null ? null : tc.ToString(),
            Math.Sqrt(truths.Sum(t => t.Snr * t.Snr)), scale, truths, assumptions));
    }

    private static void AddExtras(double[] data, string code, SimulationOptions options, double fs)
    {
        foreach (var g in options.Glitches ?? [])
        {
            if (g.SiteCode == code)
            {
                GlitchWaveform.AddTo(data, fs, g.Time.SecondsSince(options.Start), g.Kind, g.FrequencyHz, g.Quality, g.AmplitudeStrain);
            }
        }

        foreach (var line in options.Lines ?? [])
        {
            double w = 2 * Math.PI * line.FrequencyHz / fs;
            for (int i = 0; i < data.Length; i++)
            {
                data[i] += line.AmplitudeStrain * Math.Sin(w * i);
            }
        }
    }

    /// <summary>The default reference coalescence time: the middle of the simulated span.</summary>
    public static GpsTime DefaultCoalescence(SimulationOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        return options.Coalescence ?? options.Start.AddSeconds(options.DurationSeconds / 2);
    }
}
