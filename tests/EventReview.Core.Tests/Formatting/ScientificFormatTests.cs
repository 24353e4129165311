using EventReview.Core.Formatting;

namespace EventReview.Core.Tests.Formatting;

public class ScientificFormatTests
{
    [Theory]
    [InlineData(4.5123e-9, 3, "4.51×10⁻⁹")]
    [InlineData(6.03e-9, 3, "6.03×10⁻⁹")]
    [InlineData(-2.5e-21, 2, "-2.5×10⁻²¹")]
    [InlineData(1.2e5, 3, "1.2×10⁵")]
    [InlineData(12345, 3, "1.23×10⁴")]
    [InlineData(2.7e-3, 3, "0.0027")]
    [InlineData(0.001, 3, "0.001")]
    [InlineData(0.5, 3, "0.5")]
    [InlineData(9999, 4, "9999")]
    [InlineData(1234.5, 3, "1230")]
    [InlineData(0, 3, "0")]
    [InlineData(1e-12, 3, "1×10⁻¹²")]
    public void Values_are_plain_between_a_thousandth_and_ten_thousand_and_powers_of_ten_outside(double value, int digits, string expected)
    {
        Assert.Equal(expected, ScientificFormat.Format(value, digits));
    }

    [Fact]
    public void Rounding_that_carries_into_the_next_decade_moves_the_exponent_or_leaves_the_plain_range()
    {
        // Adversarial: formatting the mantissa before rounding gives "10×10⁻⁵" or "0.001" written as "1×10⁻³".
        Assert.Equal("1×10⁻⁴", ScientificFormat.Format(9.996e-5, 3));
        Assert.Equal("0.001", ScientificFormat.Format(9.9996e-4, 3));
        Assert.Equal("1×10⁴", ScientificFormat.Format(9999.6, 3));
    }

    [Fact]
    public void Special_values_are_written_in_words_and_a_unit_follows_a_space()
    {
        Assert.Equal("not a number", ScientificFormat.Format(double.NaN));
        Assert.Equal("∞", ScientificFormat.Format(double.PositiveInfinity));
        Assert.Equal("2.6×10⁻⁹ Hz", ScientificFormat.Format(2.6e-9, "Hz", 2));
        Assert.Throws<ArgumentOutOfRangeException>(() => ScientificFormat.Format(1, 0));
    }

    [Theory]
    [InlineData(3.14159e-7)]
    [InlineData(2.99792458e8)]
    [InlineData(6.674e-11)]
    public void The_text_reads_back_to_the_value_within_its_significant_digits(double value)
    {
        var text = ScientificFormat.Format(value, 4);
        var parts = text.Split("×10");
        var exponent = int.Parse(new string(parts[1].Select(c => c == '⁻' ? '-' : (char)('0' + "⁰¹²³⁴⁵⁶⁷⁸⁹".IndexOf(c))).ToArray()), System.Globalization.CultureInfo.InvariantCulture);
        var back = double.Parse(parts[0], System.Globalization.CultureInfo.InvariantCulture) * Math.Pow(10, exponent);

        Assert.Equal(value, back, value * 5e-4);
    }
}
