using EventReview.Core.Time;

namespace EventReview.Core.Tests.Time;

public class LeapSecondTableTests
{
    [Fact]
    public void Bundled_table_loads_with_18_s_from_2017_and_expires_2027_06_28()
    {
        var table = LeapSecondTable.Bundled;

        // IERS Bulletin C: GPS - UTC = 18 s since 2017-01-01.
        Assert.Equal(18, table.Entries[^1].GpsMinusUtcSeconds);
        Assert.Equal(new DateOnly(2017, 1, 1), table.Entries[^1].StartsUtc);
        Assert.Equal(new DateOnly(2027, 6, 28), table.ExpiresUtc);
        Assert.False(table.IsStale(new DateTime(2026, 1, 1, 0, 0, 0, DateTimeKind.Utc)));
        Assert.True(table.IsStale(new DateTime(2027, 6, 28, 0, 0, 0, DateTimeKind.Utc)));
    }

    [Fact]
    public void Every_offset_starts_at_the_gps_second_of_the_iers_table()
    {
        // GPS second of the UTC midnight after each leap second (IERS TAI-UTC table, CHECKS.md).
        long[] expected = [46828801, 78364802, 109900803, 173059204, 252028805, 315187206, 346723207, 393984008, 425520009,
            457056010, 504489611, 551750412, 599184013, 820108814, 914803215, 1025136016, 1119744017, 1167264018];
        var starts = LeapSecondTable.Bundled.Entries.Skip(1).Select(e => e.StartsGpsSeconds).ToArray();

        Assert.Equal(expected, starts);
    }

    [Fact]
    public void A_table_without_expiry_is_rejected_naming_the_problem()
    {
        var ex = Assert.Throws<FormatException>(() => LeapSecondTable.Parse(new StringReader("1980-01-06 19 0\n")));
        Assert.Contains("expires", ex.Message);
    }

    [Fact]
    public void A_malformed_row_is_rejected_naming_its_line()
    {
        var ex = Assert.Throws<FormatException>(() => LeapSecondTable.Parse(new StringReader("expires 2027-01-01\n1980-01-06 19 0\n1981-07-01 20 2\n")));
        Assert.Contains("line 3", ex.Message);
    }
}
