using EventReview.Core.Signal;
using EventReview.Core.Time;

namespace EventReview.Core.Tests.Signal;

public class TimeSeriesTests
{
    [Fact]
    public void Slicing_by_gps_window_keeps_the_samples_inside_it()
    {
        var ts = new TimeSeries(GpsTime.FromSeconds(100m), 10, Enumerable.Range(0, 100).Select(i => (double)i).ToArray());
        var s = ts.Slice(GpsTime.FromSeconds(101.05m), GpsTime.FromSeconds(102m));
        Assert.Equal(11.0, s.Samples[0]);
        Assert.Equal(19.0, s.Samples[^1]);
        Assert.Equal(GpsTime.FromSeconds(101.1m), s.Start);
        Assert.Equal(GpsTime.FromSeconds(100.5m), ts.TimeOf(5));
    }

    [Fact]
    public void A_window_outside_the_data_is_refused()
    {
        var ts = new TimeSeries(GpsTime.FromSeconds(100m), 10, new double[10]);
        Assert.Throws<ArgumentException>(() => ts.Slice(GpsTime.FromSeconds(200m), GpsTime.FromSeconds(201m)));
    }
}
