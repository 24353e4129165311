using EventReview.Core.Cases;
using EventReview.Core.Network;
using EventReview.Core.Time;
using EventReview.Core.Inputs;

namespace EventReview.Web.Services;

/// <summary>
/// Reads the parts of an <see cref="OpenCaseRequest"/> that need the network or a conversion, naming every refusal by
/// its request field (<c>arrivals[1].snr</c>); the values themselves are checked by <see cref="CaseArrival"/> and
/// <see cref="ReviewCase.Open"/>.
/// </summary>
public static class OpenCaseInput
{
    /// <summary>The checked arrivals, in request order.</summary>
    /// <exception cref="ArgumentException">Naming the field: a null member, a missing or unknown site, a missing or out-of-range time, an SNR out of range.</exception>
    public static List<CaseArrival> Arrivals(IReadOnlyList<ArrivalRequest>? requested, DetectorNetwork? network)
    {
        var arrivals = new List<CaseArrival>();
        var index = 0;
        foreach (var a in requested ?? [])
        {
            var field = $"arrivals[{index++}]";
            if (a is null)
            {
                throw new ArgumentException($"{field} is null; send an object with site, gpsTime and snr.", field);
            }

            if (string.IsNullOrWhiteSpace(a.Site))
            {
                throw new ArgumentException($"{field}.site is required.", $"{field}.site");
            }

            if (network?.Find(a.Site) is null)
            {
                throw new ArgumentException($"{field}.site: the network has no site '{Shown(a.Site)}' (known: {string.Join(", ", network?.Sites.Select(s => s.Code) ?? [])}).", $"{field}.site");
            }

            if (a.GpsTime is null)
            {
                throw new ArgumentException($"{field}.gpsTime is required.", $"{field}.gpsTime");
            }

            try
            {
                arrivals.Add(new CaseArrival(a.Site, Gps(a.GpsTime.Value, "gpsTime"), a.Snr ?? 0));
            }
            catch (ArgumentException ex)
            {
                // The arrival names its own field (site, gpsTime, snr); the request calls it arrivals[i].field.
                throw new ArgumentException($"{field}.{UserMessage.From(ex)}", $"{field}.{ex.ParamName}", ex);
            }
        }

        return arrivals;
    }

    /// <summary>GPS time from decimal seconds; a value no GPS time can hold is refused like one outside the range.</summary>
    /// <exception cref="ArgumentOutOfRangeException">Naming <paramref name="field"/>.</exception>
    public static GpsTime Gps(decimal seconds, string field)
    {
        try
        {
            return GpsTime.FromSeconds(seconds);
        }
        catch (ArgumentOutOfRangeException)
        {
            throw new ArgumentOutOfRangeException(field, seconds, $"{field}: a GPS time must be {EventReview.Core.Inputs.GpsRange.Describe()} (got {seconds}).");
        }
    }

    /// <summary>A user-supplied value for a message: at most 40 characters.</summary>
    public static string Shown(string? value) => value is null ? string.Empty : value.Length <= 40 ? value : value[..40] + "...";
}
