using System.Globalization;
using EventReview.Core.Time;

namespace EventReview.Core.Inputs;

/// <summary>
/// Checks that entities run on every value before they store it. Each throws an <see cref="ArgumentException"/> (or
/// <see cref="ArgumentOutOfRangeException"/>) whose parameter name is the field as the API and forms call it and whose
/// message says what was expected; nothing has changed when one throws.
/// </summary>
public static class InputGuard
{
    /// <summary>Refuses NaN, infinities and values outside [<paramref name="min"/>, <paramref name="max"/>].</summary>
    /// <param name="value">The number.</param>
    /// <param name="min">Smallest accepted value (inclusive).</param>
    /// <param name="max">Largest accepted value (inclusive).</param>
    /// <param name="field">Field name reported with the refusal.</param>
    /// <param name="what">What the number is, with its unit, for the message ("SNR", "timing uncertainty (s)").</param>
    /// <exception cref="ArgumentOutOfRangeException">When the value is not finite or outside the range.</exception>
    public static double Finite(double value, double min, double max, string field, string what)
    {
        if (!double.IsFinite(value) || value < min || value > max)
        {
            throw new ArgumentOutOfRangeException(field, value,
                $"{field}: {what} must be a finite number from {Number(min)} to {Number(max)} (got {Number(value)}).");
        }

        return value;
    }

    /// <summary>Refuses a GPS time outside <see cref="GpsRange"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">When the time is outside the range.</exception>
    public static GpsTime Gps(GpsTime value, string field)
    {
        if (!GpsRange.Contains(value))
        {
            throw new ArgumentOutOfRangeException(field, value.ToString(), $"{field}: a GPS time must be {GpsRange.Describe()} (got {value}).");
        }

        return value;
    }

    /// <summary>Refuses text longer than <paramref name="maxLength"/> characters; null counts as empty.</summary>
    /// <exception cref="ArgumentException">When the text is too long.</exception>
    public static string Text(string? value, int maxLength, string field)
    {
        value ??= string.Empty;
        if (value.Length > maxLength)
        {
            throw new ArgumentException($"{field} must be at most {maxLength.ToString("N0", CultureInfo.InvariantCulture)} characters (got {value.Length.ToString("N0", CultureInfo.InvariantCulture)}).", field);
        }

        return value;
    }

    /// <summary>
    /// An identifier: trimmed, 1 to <paramref name="maxLength"/> characters, with no invisible, control or
    /// bidirectional characters (<see cref="HiddenCharacters"/>), so that what is shown is what is stored.
    /// </summary>
    /// <exception cref="ArgumentException">When the id is empty, too long or holds a hidden character.</exception>
    public static string Identifier(string? value, int maxLength, string field)
    {
        var id = (value ?? string.Empty).Trim();
        if (id.Length == 0)
        {
            throw new ArgumentException($"{field} is required.", field);
        }

        if (id.Length > maxLength)
        {
            throw new ArgumentException($"{field} must be at most {maxLength} characters (got {id.Length}).", field);
        }

        var (code, position) = HiddenCharacters.Find(id);
        if (code >= 0)
        {
            throw new ArgumentException($"{field} must hold only visible characters; character {position} is U+{code:X4}, an invisible, control or bidirectional character.", field);
        }

        return id;
    }

    private static string Number(double x) => x.ToString("G6", CultureInfo.InvariantCulture);
}
