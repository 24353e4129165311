using System.Globalization;
using System.Text;

namespace EventReview.Core.Evidence.Roles;

/// <summary>
/// Guesses an attached file's role from the start of its content (a CSV header, JSON keys, two numeric columns, the HDF5
/// signature) and, where the content cannot tell, from its name (a site code token, "input", "output", "blind"). A guess
/// only preselects; people confirm or change it at upload.
/// </summary>
public static class FileRoleGuesser
{
    /// <summary>How much of the file's start the guess reads, bytes.</summary>
    public const int HeadBytes = 8192;

    /// <summary>
    /// Median |value| below which a "gps_time value" series is taken for strain rather than a sensor's series (strain is
    /// dimensionless and of order 1e-21; sensors record in volts, metres, tesla or counts). Common practice, not a rule.
    /// </summary>
    public const double StrainMagnitudeLimit = 1e-15;

    private static readonly byte[] Hdf5Signature = [0x89, (byte)'H', (byte)'D', (byte)'F', 0x0d, 0x0a, 0x1a, 0x0a];

    /// <summary>Guesses the role of a file from its name and the first bytes of its content.</summary>
    /// <param name="fileName">The file's name as uploaded (only its tokens are used).</param>
    /// <param name="head">The first bytes of the file (up to <see cref="HeadBytes"/> are read).</param>
    /// <param name="siteCodes">The network's site codes, to recognise a site in the name or the first comment.</param>
    public static FileRoleGuess Guess(string? fileName, ReadOnlySpan<byte> head, IReadOnlyCollection<string> siteCodes)
    {
        ArgumentNullException.ThrowIfNull(siteCodes);
        var name = fileName ?? string.Empty;
        var site = SiteInName(name, siteCodes);
        if (head.Length >= Hdf5Signature.Length && head[..Hdf5Signature.Length].SequenceEqual(Hdf5Signature))
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.Strain, site), "HDF5 signature" + SiteNote(site));
        }

        var text = Encoding.UTF8.GetString(head[..Math.Min(head.Length, HeadBytes)]);
        var lines = text.Split('\n').Select(l => l.Trim().TrimStart('\uFEFF')).ToList();
        var comments = lines.Where(l => l.StartsWith('#') || l.StartsWith('%')).ToList();
        var data = lines.Where(l => l.Length > 0 && !l.StartsWith('#') && !l.StartsWith('%')).Take(20).ToList();
        if (data.Count == 0)
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.Other), "no readable lines");
        }

        if (data[0].StartsWith('{'))
        {
            return text.Contains("\"stages\"", StringComparison.Ordinal)
                ? new FileRoleGuess(new FileRole(FileRoleKind.StageModel), "JSON with \"stages\"")
                : new FileRoleGuess(new FileRole(FileRoleKind.Configuration), "JSON object (a configuration snapshot)");
        }

        var header = data[0].Split(',').Select(c => c.Trim().ToLowerInvariant()).ToList();
        if (ByHeader(header, name, site) is { } byHeader)
        {
            return byHeader;
        }

        if (IsSeries(data, out var medianMagnitude))
        {
            var inComment = site is null ? SiteInComments(comments, siteCodes) : null;
            return Series(name, site ?? inComment, inComment is null ? SiteNote(site) : $"; site {inComment} from the first comment", medianMagnitude);
        }

        if (data.Count(l => l.Contains('=', StringComparison.Ordinal)) * 2 >= data.Count)
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.Configuration), "\"key = value\" lines");
        }

        return new FileRoleGuess(new FileRole(FileRoleKind.Other), "no known header or layout");
    }

    private static FileRoleGuess? ByHeader(List<string> h, string name, string? site)
    {
        var why = "header " + string.Join(',', h);
        if (Has(h, "site", "flag", "start_gps", "end_gps"))
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.DataQualitySegments), why);
        }

        if (Has(h, "site", "channel", "gps_time", "snr"))
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.AuxiliaryTriggers), why);
        }

        if (Has(h, "site", "channel", "kind", "location"))
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.SensorInventory), why);
        }

        if (Has(h, "site", "start_gps", "end_gps", "kind", "status"))
        {
            return HasToken(name, "blind")
                ? new FileRoleGuess(new FileRole(FileRoleKind.BlindInjectionRecord), why + " and \"blind\" in the name")
                : new FileRoleGuess(new FileRole(FileRoleKind.InjectionLog), why);
        }

        if (Has(h, "frequency_hz", "coupling"))
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.CouplingFunction), why);
        }

        if (Has(h, "gps_time", "snr") && !h.Contains("site"))
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.SearchTriggers, site), why + SiteNote(site));
        }

        if (Has(h, "start_gps", "end_gps") && !h.Contains("site"))
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.AnalysedTime, site), why + SiteNote(site));
        }

        return null;
    }

    private static FileRoleGuess Series(string name, string? site, string siteNote, double medianMagnitude)
    {
        const string why = "two numeric columns (gps_time value)";
        if (HasToken(name, "input"))
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.StageInput), why + " and \"input\" in the name");
        }

        if (HasToken(name, "output"))
        {
            return new FileRoleGuess(new FileRole(FileRoleKind.StageOutput), why + " and \"output\" in the name");
        }

        var magnitude = medianMagnitude.ToString("0.#e+0", CultureInfo.InvariantCulture);
        return medianMagnitude < StrainMagnitudeLimit
            ? new FileRoleGuess(new FileRole(FileRoleKind.Strain, site), $"{why}, median |value| {magnitude} (strain-like){siteNote}")
            : new FileRoleGuess(new FileRole(FileRoleKind.SensorSeries), $"{why}, median |value| {magnitude} (larger than strain)");
    }

    private static bool IsSeries(List<string> data, out double medianMagnitude)
    {
        var values = new List<double>();
        foreach (var line in data)
        {
            var parts = line.Split([' ', '\t', ','], StringSplitOptions.RemoveEmptyEntries);
            if (parts.Length != 2 || !double.TryParse(parts[0], NumberStyles.Float, CultureInfo.InvariantCulture, out _) ||
                !double.TryParse(parts[1], NumberStyles.Float, CultureInfo.InvariantCulture, out var v))
            {
                medianMagnitude = double.NaN;
                return false;
            }

            values.Add(Math.Abs(v));
        }

        values.Sort();
        medianMagnitude = values[values.Count / 2];
        return true;
    }

    private static bool Has(List<string> header, params string[] columns) => columns.All(header.Contains);

    private static IEnumerable<string> Tokens(string text) =>
        text.Split(['-', '_', '.', ' ', ':', '/', ','], StringSplitOptions.RemoveEmptyEntries);

    private static bool HasToken(string name, string word) =>
        Tokens(Path.GetFileName(name)).Any(t => t.Equals(word, StringComparison.OrdinalIgnoreCase));

    private static string? SiteInName(string name, IReadOnlyCollection<string> codes) =>
        Tokens(Path.GetFileName(name)).Select(t => codes.FirstOrDefault(c => string.Equals(c, t, StringComparison.OrdinalIgnoreCase))).FirstOrDefault(c => c is not null);

    private static string? SiteInComments(List<string> comments, IReadOnlyCollection<string> codes) =>
        comments.Take(3).SelectMany(Tokens).Select(t => codes.FirstOrDefault(c => string.Equals(c, t, StringComparison.Ordinal))).FirstOrDefault(c => c is not null);

    private static string SiteNote(string? site) => site is null ? "; site not recognised" : $"; site {site} from the name";
}
