using System.Globalization;
using EventReview.Core.Signal.Chirps;

namespace EventReview.Core.Signal.TimeFrequency;

/// <summary>What a chirp fit can and cannot tell, in words, from the track it rests on.</summary>
internal static class ChirpScope
{
    public static List<string> For(double? mc, double? sigma, double[] t, double[] f, QMap map, ChirpTrackOptions options)
    {
        var ci = CultureInfo.InvariantCulture;
        double seconds = t.Length > 1 ? t[^1] - t[0] : 0;
        double low = map.FrequenciesHz[0];
        var scope = new List<string>();
        if (mc is not { } m)
        {
            scope.Add("no chirp-like track: the map cannot tell a chirp mass; it can still show where the excess power lies");
            return scope;
        }

        double inBand = Chirp.TimeToCoalescence(m, low);
        scope.Add(string.Create(ci,
            $"can tell: the frequency rises from {f[0]:0} to {f[^1]:0} Hz over {seconds * 1e3:0} ms of track ({t.Length} points), and the leading-order chirp mass that fits that rise, {m:0.#} ± {sigma ?? double.NaN:0.#} solar masses"));
        scope.Add("cannot tell: the component masses, their ratio or spins, the distance or the sky position; merger and ringdown are outside the leading-order law");
        if (m > options.HighMassMsun)
        {
            scope.Add(string.Create(ci,
                $"high chirp mass (above {options.HighMassMsun:0} solar masses): such a signal spends only about {inBand * 1e3:0} ms above {low:0} Hz, so the track holds a few cycles and reaches merger frequencies; the fitted chirp mass is indicative only (the leading-order law misreads the merger part), and a short glitch with rising frequency could give a similar track"));
        }
        else if (seconds < 0.1 || t.Length < 2 * options.MinimumPoints)
        {
            scope.Add(string.Create(ci, $"short track ({seconds * 1e3:0} ms, {t.Length} points): the chirp mass rests on few independent tiles; treat it as indicative"));
        }

        return scope;
    }
}
