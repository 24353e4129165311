using System.Globalization;
using System.Text;

namespace EventReview.Core.Formatting;

/// <summary>
/// The one way scientific values are written for people, in the app, the CLI's text and summaries: plain decimals from
/// 0.001 up to 10,000, otherwise a mantissa times a power of ten with the exponent in superscript digits
/// ("4.51×10⁻⁹", "1.2×10⁵"). Machine formats (JSON, CSV) keep round-trip numbers; this is for reading.
/// </summary>
public static class ScientificFormat
{
    /// <summary>Smallest magnitude written as a plain decimal.</summary>
    public const double PlainFrom = 1e-3;

    /// <summary>Magnitude from which a power of ten is used again.</summary>
    public const double PlainBelow = 1e4;

    private const string Superscripts = "⁰¹²³⁴⁵⁶⁷⁸⁹";

    /// <summary>
    /// <paramref name="value"/> with <paramref name="significant"/> significant digits (trailing zeros dropped):
    /// 4.5123e-9 → "4.51×10⁻⁹", 0.0027 → "0.0027", 12345 → "1.23×10⁴", 0 → "0". NaN is "not a number", infinities "∞" and "−∞".
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">When <paramref name="significant"/> is not from 1 to 15.</exception>
    public static string Format(double value, int significant = 3)
    {
        if (significant is < 1 or > 15)
        {
            throw new ArgumentOutOfRangeException(nameof(significant), significant, "significant digits must be from 1 to 15.");
        }

        if (double.IsNaN(value))
        {
            return "not a number";
        }

        if (double.IsInfinity(value))
        {
            return value > 0 ? "∞" : "−∞";
        }

        if (value == 0)
        {
            return "0";
        }

        // Round to the significant digits first: 9.996e-5 with 3 digits is 1×10⁻⁴, not 10×10⁻⁵.
        var rounded = double.Parse(value.ToString("E" + (significant - 1), CultureInfo.InvariantCulture), CultureInfo.InvariantCulture);
        var magnitude = Math.Abs(rounded);
        var exponent = (int)Math.Floor(Math.Log10(magnitude));
        if (Math.Abs(rounded / Math.Pow(10, exponent)) >= 10)
        {
            exponent++;
        }

        if (magnitude >= PlainFrom && magnitude < PlainBelow)
        {
            var decimals = Math.Max(0, significant - 1 - exponent);
            return Trim(rounded.ToString("F" + decimals, CultureInfo.InvariantCulture));
        }

        var mantissa = rounded / Math.Pow(10, exponent);
        return Trim(mantissa.ToString("F" + (significant - 1), CultureInfo.InvariantCulture)) + "×10" + Superscript(exponent);
    }

    /// <summary>Like <see cref="Format(double, int)"/>, with a unit after a thin space when given ("2.6×10⁻⁹ Hz").</summary>
    public static string Format(double value, string unit, int significant = 3) =>
        string.IsNullOrEmpty(unit) ? Format(value, significant) : Format(value, significant) + " " + unit;

    private static string Trim(string number) =>
        number.Contains('.', StringComparison.Ordinal) ? number.TrimEnd('0').TrimEnd('.') : number;

    private static string Superscript(int exponent)
    {
        var sb = new StringBuilder();
        if (exponent < 0)
        {
            sb.Append('⁻');
        }

        foreach (var digit in Math.Abs(exponent).ToString(CultureInfo.InvariantCulture))
        {
            sb.Append(Superscripts[digit - '0']);
        }

        return sb.ToString();
    }
}
