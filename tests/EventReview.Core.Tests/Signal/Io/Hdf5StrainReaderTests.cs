using EventReview.Core.Signal.Io;
using EventReview.Core.Time;
using PureHDF;

namespace EventReview.Core.Tests.Signal.Io;

public class Hdf5StrainReaderTests
{
    [Fact]
    public void Hdf5_round_trip_reads_samples_and_timing_from_attributes()
    {
        var path = Path.Combine(Path.GetTempPath(), $"er-h5-{Guid.NewGuid():N}.h5");
        var data = Enumerable.Range(0, 1000).Select(i => Math.Sin(i * 0.01) * 1e-21).ToArray();
        try
        {
            var file = new H5File
            {
                ["KX"] = new H5Group
                {
                    ["strain"] = new H5Dataset(data)
                    {
                        Attributes = new() { ["start_gps"] = 1300000000.25, ["sample_rate_hz"] = 4096.0 },
                    },
                    ["other"] = new H5Dataset(data) { Attributes = new() { ["dt"] = 1.0 / 1024 } },
                },
            };
            file.Write(path);

            var ts = Hdf5StrainReader.Read(path, new Hdf5StrainOptions("/KX/strain"));
            Assert.Equal(data, ts.Samples);
            Assert.Equal(4096, ts.SampleRateHz);
            Assert.Equal(GpsTime.FromSeconds(1300000000.25m), ts.Start);

            var byHand = Hdf5StrainReader.Read(path, new Hdf5StrainOptions("/KX/other", Start: GpsTime.FromSeconds(5m)));
            Assert.Equal(1024, byHand.SampleRateHz, 9);
            Assert.Equal(GpsTime.FromSeconds(5m), byHand.Start);

            var ex = Assert.Throws<StrainFormatException>(() => Hdf5StrainReader.Read(path, new Hdf5StrainOptions("/KX/other")));
            Assert.Contains("start_gps", ex.Message);
            Assert.Throws<StrainFormatException>(() => Hdf5StrainReader.Read(path, new Hdf5StrainOptions("/KX/missing")));
        }
        finally
        {
            File.Delete(path);
        }
    }
}
