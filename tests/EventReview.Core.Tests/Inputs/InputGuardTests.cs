using EventReview.Core.Inputs;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Inputs;

public class InputGuardTests
{
    [Theory]
    [InlineData(double.NaN)]
    [InlineData(double.PositiveInfinity)]
    [InlineData(double.NegativeInfinity)]
    [InlineData(1e308)]
    [InlineData(-1e-300)]
    [InlineData(10_000.000001)]
    public void A_number_that_is_not_finite_or_out_of_range_is_refused_naming_the_field(double value)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => InputGuard.Finite(value, 0, InputLimits.MaxSnr, "snr", "the SNR"));

        Assert.Equal("snr", ex.ParamName);
        Assert.StartsWith("snr: the SNR must be a finite number from 0 to 10000", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(10_000.0)]
    [InlineData(5e-324)]
    public void The_bounds_themselves_are_accepted(double value)
    {
        Assert.Equal(value, InputGuard.Finite(value, 0, InputLimits.MaxSnr, "snr", "the SNR"));
    }

    [Fact]
    public void Text_at_the_limit_is_accepted_and_one_more_character_is_refused()
    {
        Assert.Equal(2000, InputGuard.Text(new string('d', 2000), InputLimits.MaxDescriptionLength, "description").Length);
        Assert.Equal(string.Empty, InputGuard.Text(null, 10, "description"));

        var ex = Assert.Throws<ArgumentException>(() => InputGuard.Text(new string('d', 2001), InputLimits.MaxDescriptionLength, "description"));

        Assert.Equal("description", ex.ParamName);
        Assert.Contains("at most 2,000 characters (got 2,001)", ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("  TC-0001 ", "TC-0001")]
    [InlineData("ΑΒ-ünï-候補", "ΑΒ-ünï-候補")]
    public void An_identifier_is_trimmed_and_may_hold_any_visible_letters(string raw, string kept)
    {
        Assert.Equal(kept, InputGuard.Identifier(raw, 128, "candidateId"));
    }

    [Theory]
    [InlineData("TC-\u202Egpj.exe", "U+202E")]
    [InlineData("TC\u200B0001", "U+200B")]
    [InlineData("TC\u00000001", "U+0000")]
    public void An_identifier_with_a_hidden_character_is_refused_naming_it(string raw, string named)
    {
        var ex = Assert.Throws<ArgumentException>(() => InputGuard.Identifier(raw, 128, "candidateId"));

        Assert.Equal("candidateId", ex.ParamName);
        Assert.Contains(named, ex.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("")]
    [InlineData("   ")]
    [InlineData(null)]
    public void An_empty_identifier_is_refused(string? raw)
    {
        Assert.Equal("candidateId", Assert.Throws<ArgumentException>(() => InputGuard.Identifier(raw, 128, "candidateId")).ParamName);
    }

    [Fact]
    public void A_gps_time_outside_the_range_is_refused_and_one_inside_is_kept()
    {
        // CHECKS.md (ref, astropy): GPS 1480204818 is 2026-12-02T00:00:00 UTC.
        var inside = new GpsTime(1_480_204_818L * GpsTime.NanosecondsPerSecond);
        Assert.Equal(inside, InputGuard.Gps(inside, "gpsTime"));

        Assert.Equal("gpsTime", Assert.Throws<ArgumentOutOfRangeException>(() => InputGuard.Gps(GpsTime.Epoch, "gpsTime")).ParamName);
        Assert.Throws<ArgumentOutOfRangeException>(() => InputGuard.Gps(new GpsTime(-1), "gpsTime"));
        Assert.Throws<ArgumentOutOfRangeException>(() => InputGuard.Gps(GpsRange.Latest, "gpsTime"));
    }
}
