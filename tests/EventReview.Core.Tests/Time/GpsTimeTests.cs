using System.Globalization;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Time;

public class GpsTimeTests
{
    [Theory]
    [InlineData("1234567890.123456789", 1234567890123456789L)]
    [InlineData("1400000000", 1400000000000000000L)]
    [InlineData("0.000000001", 1L)]
    [InlineData("-0.5", -500000000L)]
    [InlineData("  12.25  ", 12250000000L)]
    [InlineData("1.5e3", 1500000000000L)]
    public void Decimal_text_parses_to_the_exact_nanosecond(string text, long nanoseconds)
    {
        Assert.True(GpsTime.TryParse(text, out var t));

        Assert.Equal(nanoseconds, t.Nanoseconds);
    }

    [Theory]
    [InlineData(null)]
    [InlineData("")]
    [InlineData("  ")]
    [InlineData("abc")]
    [InlineData("12,5")]
    [InlineData("1e20")]
    [InlineData("9200000001")]
    public void Text_that_is_not_a_gps_time_in_range_is_refused(string? text)
    {
        Assert.False(GpsTime.TryParse(text, out var t));
        Assert.Equal(default, t);
    }

    [Theory]
    [InlineData(1400000000400000000L, "1400000000.4")]
    [InlineData(1400000000000000000L, "1400000000")]
    [InlineData(1234567890123456789L, "1234567890.123456789")]
    [InlineData(1L, "0.000000001")]
    [InlineData(-1500000000L, "-1.5")]
    [InlineData(0L, "0")]
    public void Formatting_keeps_every_digit_and_drops_trailing_zeros(long nanoseconds, string text)
    {
        Assert.Equal(text, new GpsTime(nanoseconds).ToString());
    }

    [Fact]
    public void Formatting_then_parsing_gives_back_the_same_instant_for_many_random_times()
    {
        var random = new Random(20260301);
        for (var i = 0; i < 20_000; i++)
        {
            var ns = random.NextInt64(-2_000_000_000_000_000_000L, 9_000_000_000_000_000_000L);
            var t = new GpsTime(ns);

            Assert.True(GpsTime.TryParse(t.ToString(), out var back), t.ToString());
            Assert.Equal(t, back);
        }
    }

    [Fact]
    public void Formatting_does_not_depend_on_the_current_culture()
    {
        var saved = CultureInfo.CurrentCulture;
        try
        {
            CultureInfo.CurrentCulture = new CultureInfo("de-DE");
            Assert.Equal("12.5", new GpsTime(12_500_000_000L).ToString());
            Assert.Equal("12.500", new GpsTime(12_500_000_000L).ToString(3));
            Assert.True(GpsTime.TryParse("12.5", out var t));
            Assert.Equal(12_500_000_000L, t.Nanoseconds);
        }
        finally
        {
            CultureInfo.CurrentCulture = saved;
        }
    }

    [Theory]
    [InlineData("0.0000000005", 0L)]
    [InlineData("0.0000000015", 2L)]
    [InlineData("0.0000000025", 2L)]
    [InlineData("0.00000000251", 3L)]
    public void Digits_below_a_nanosecond_round_half_to_even(string text, long nanoseconds)
    {
        Assert.True(GpsTime.TryParse(text, out var t));

        Assert.Equal(nanoseconds, t.Nanoseconds);
    }

    [Fact]
    public void Seconds_given_as_a_double_round_to_the_nearest_nanosecond()
    {
        Assert.Equal(1_000_000_000_250_000_000L, GpsTime.FromSeconds(1_000_000_000.25).Nanoseconds);
        Assert.Equal(-250_000_000L, GpsTime.FromSeconds(-0.25).Nanoseconds);
        Assert.Equal(123_456_789L, GpsTime.FromSeconds(0.123456789).Nanoseconds);
    }

    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(1e10)]
    public void Seconds_that_are_not_finite_or_out_of_range_are_refused(double seconds)
    {
        Assert.Equal("seconds", Assert.Throws<ArgumentOutOfRangeException>(() => GpsTime.FromSeconds(seconds)).ParamName);
    }

    [Fact]
    public void Whole_seconds_are_the_floor_also_before_the_epoch()
    {
        Assert.Equal(12, new GpsTime(12_999_999_999L).WholeSeconds);
        Assert.Equal(-1, new GpsTime(-1L).WholeSeconds);
        Assert.Equal(-1, new GpsTime(-1_000_000_000L).WholeSeconds);
        Assert.Equal(-2, new GpsTime(-1_000_000_001L).WholeSeconds);
    }

    [Fact]
    public void Adding_seconds_and_measuring_the_difference_are_inverse()
    {
        var t = GpsTime.FromSeconds(1_400_000_000.123456789m);

        var later = t.AddSeconds(0.0123456);

        Assert.Equal(12_345_600L, later.Nanoseconds - t.Nanoseconds);
        Assert.Equal(0.0123456, later.SecondsSince(t), 12);
        Assert.Equal(-0.0123456, t.SecondsSince(later), 12);
        Assert.True(t < later && later > t && t <= later && later >= t);
        Assert.Equal(-1, t.CompareTo(later));
    }

    [Fact]
    public void Fixed_decimals_round_the_seconds()
    {
        Assert.Equal("1400000000.123", GpsTime.FromSeconds(1_400_000_000.1234m).ToString(3));
        Assert.Equal("1400000000", GpsTime.FromSeconds(1_400_000_000.4m).ToString(0));
    }
}
