using EventReview.Core.Environment;

namespace EventReview.Web.Services.Checks;

/// <summary>
/// Parameters of the environment and veto lookup as run from a case: the attached input files (by SHA-256), the
/// windows, and the coupling screen. The light-travel window defaults to the largest light-travel time between the
/// case's sites in the network. Coupling is estimated when a candidate strain amplitude is known at a site: read from
/// that site's strain data (<paramref name="StrainShas"/>) or typed (<paramref name="CandidateStrainAmplitude"/>); a sensor's
/// noise amplitude is read from the data file the inventory names for it, else typed (<paramref name="SensorNoiseAmplitude"/>).
/// </summary>
/// <param name="StrainShas">Strain text files ("gps_time value") per site code, for reading the candidate's strain amplitude; null for none.</param>
public sealed record EnvironmentCheckParameters(
    string? SegmentsSha,
    string? TriggersSha,
    string? InventorySha = null,
    string? InjectionsSha = null,
    double WindowSeconds = 1.0,
    IReadOnlyDictionary<string, double>? WindowSecondsByKind = null,
    double RateWindowSeconds = 3600.0,
    double? LightTravelWindowSeconds = null,
    double CouplingFraction = 0.1,
    double? CandidateStrainAmplitude = null,
    double CouplingBandLowHz = 20.0,
    double CouplingBandHighHz = 500.0,
    double? SensorNoiseAmplitude = null,
    IReadOnlyDictionary<string, string>? StrainShas = null)
{
    /// <summary>The per-kind windows as the Core wants them.</summary>
    public IReadOnlyDictionary<SensorKind, double>? KindWindows() => WindowSecondsByKind?.ToDictionary(kv => Enum.Parse<SensorKind>(kv.Key, true), kv => kv.Value);

    /// <exception cref="ArgumentException">When a value is out of range (message names it).</exception>
    public void Validate()
    {
        Positive(WindowSeconds, 3600, "Window (s)");
        Positive(RateWindowSeconds, 30 * 86400, "Rate window (s)");
        foreach (var (kind, w) in WindowSecondsByKind ?? new Dictionary<string, double>())
        {
            if (!Enum.TryParse<SensorKind>(kind, true, out _) || int.TryParse(kind, out _))
            {
                throw new ArgumentException($"Window per kind: '{kind}' is not one of {string.Join(", ", Enum.GetNames<SensorKind>().Select(n => n.ToLowerInvariant()))}.", nameof(WindowSecondsByKind));
            }

            Positive(w, 3600, $"Window for {kind} (s)");
        }

        if (LightTravelWindowSeconds is { } lt && (!double.IsFinite(lt) || lt < 0 || lt > 1))
        {
            throw new ArgumentException("Light-travel window must be between 0 and 1 s.", nameof(LightTravelWindowSeconds));
        }

        Positive(CouplingFraction, 10, "Coupling flag fraction");
        if (CandidateStrainAmplitude is { } h)
        {
            Positive(h, 1, "Candidate strain amplitude");
            if (!(CouplingBandLowHz > 0) || !(CouplingBandHighHz > CouplingBandLowHz) || !double.IsFinite(CouplingBandHighHz))
            {
                throw new ArgumentException("Coupling band must satisfy 0 < low < high (Hz).", nameof(CouplingBandLowHz));
            }
        }

        if (CouplingBandLowHz <= 0 || CouplingBandHighHz <= CouplingBandLowHz || !double.IsFinite(CouplingBandHighHz))
        {
            throw new ArgumentException("Coupling band must satisfy 0 < low < high (Hz).", nameof(CouplingBandLowHz));
        }

        if (SensorNoiseAmplitude is { } n)
        {
            Positive(n, double.MaxValue, "Sensor noise amplitude");
        }
    }

    /// <summary>Parses "seismic=10, weather=10" into a per-kind window map (empty text gives null).</summary>
    /// <exception cref="ArgumentException">When an entry is not KIND=SECONDS.</exception>
    public static IReadOnlyDictionary<string, double>? ParseKindWindows(string? text)
    {
        if (string.IsNullOrWhiteSpace(text))
        {
            return null;
        }

        var map = new SortedDictionary<string, double>(StringComparer.Ordinal);
        foreach (var part in text.Split([',', ';'], StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            var kv = part.Split('=', 2, StringSplitOptions.TrimEntries);
            if (kv.Length != 2 || !double.TryParse(kv[1], System.Globalization.NumberStyles.Float, System.Globalization.CultureInfo.InvariantCulture, out var w))
            {
                throw new ArgumentException($"Window per kind: '{part}' is not KIND=SECONDS (e.g. seismic=10).", nameof(WindowSecondsByKind));
            }

            map[kv[0].ToLowerInvariant()] = w;
        }

        return map;
    }

    private static void Positive(double v, double max, string name)
    {
        if (!double.IsFinite(v) || v <= 0 || v > max)
        {
            throw new ArgumentException($"{name} must be > 0" + (max < double.MaxValue ? $" and at most {max}." : "."), name);
        }
    }
}
