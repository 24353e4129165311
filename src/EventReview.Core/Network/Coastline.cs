using System.Globalization;

namespace EventReview.Core.Network;

/// <summary>
/// A simple outline of the continents for the network map: Natural Earth land at 1:110m (public domain), from the npm package
/// world-atlas 2.0.2, converted once to lon/lat rings by <c>docs/coastline/convert.py</c> and shipped as the embedded
/// resource <c>Network/land-110m.txt</c> (no tiles, nothing fetched at run time; credited in README and NOTICE).
/// </summary>
public static class Coastline
{
    private static readonly Lazy<IReadOnlyList<CoastlineRing>> Loaded = new(Load);

    /// <summary>The rings of land (and the few holes in it), in file order; longitude east and latitude north in degrees.</summary>
    public static IReadOnlyList<CoastlineRing> Rings => Loaded.Value;

    /// <summary>Parses the ring file format (see <c>docs/coastline/convert.py</c>): '#' comments, then "o|h lon,lat lon,lat ...".</summary>
    /// <exception cref="FormatException">When a line is not in that form or a value is outside ±180° / ±90°.</exception>
    public static IReadOnlyList<CoastlineRing> Parse(TextReader reader)
    {
        ArgumentNullException.ThrowIfNull(reader);
        var rings = new List<CoastlineRing>();
        int number = 0;
        while (reader.ReadLine() is { } line)
        {
            number++;
            if (line.Length == 0 || line[0] == '#')
            {
                continue;
            }

            var parts = line.Split(' ', StringSplitOptions.RemoveEmptyEntries);
            if (parts[0] is not ("o" or "h") || parts.Length < 4)
            {
                throw new FormatException($"Coastline line {number}: expected 'o' or 'h' and at least three lon,lat points.");
            }

            var lon = new double[parts.Length - 1];
            var lat = new double[parts.Length - 1];
            for (int k = 1; k < parts.Length; k++)
            {
                var xy = parts[k].Split(',');
                if (xy.Length != 2 || !double.TryParse(xy[0], NumberStyles.Float, CultureInfo.InvariantCulture, out lon[k - 1])
                    || !double.TryParse(xy[1], NumberStyles.Float, CultureInfo.InvariantCulture, out lat[k - 1])
                    || Math.Abs(lon[k - 1]) > 180 || Math.Abs(lat[k - 1]) > 90)
                {
                    throw new FormatException($"Coastline line {number}: '{parts[k]}' is not lon,lat in degrees (|lon| ≤ 180, |lat| ≤ 90).");
                }
            }

            rings.Add(new CoastlineRing(parts[0] == "h", lon, lat));
        }

        return rings;
    }

    private static IReadOnlyList<CoastlineRing> Load()
    {
        using var stream = typeof(Coastline).Assembly.GetManifestResourceStream("EventReview.Core.Network.land-110m.txt")
            ?? throw new InvalidOperationException("The coastline resource EventReview.Core.Network.land-110m.txt is missing from the build.");
        using var reader = new StreamReader(stream);
        return Parse(reader);
    }
}
