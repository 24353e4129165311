using EventReview.Core.Time;
using PureHDF;

namespace EventReview.Core.Signal.Io;

/// <summary>Reads strain from a generic HDF5 file with the PureHDF library (pure managed code, no native HDF5 needed).</summary>
public static class Hdf5StrainReader
{
    /// <summary>
    /// Reads the dataset named in <paramref name="options"/> as doubles; the start time and sample rate come from the options
    /// when given, otherwise from the dataset's attributes. Samples must be finite.
    /// </summary>
    /// <exception cref="StrainFormatException">When the dataset or a needed attribute is missing, or values are not finite
    /// (LineNumber 0 for file-level problems, otherwise the 1-based index of the first bad sample).</exception>
    public static TimeSeries Read(string path, Hdf5StrainOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        using var file = H5File.OpenRead(path);
        IH5Dataset dataset;
        try
        {
            dataset = file.Dataset(options.DatasetPath);
        }
        catch (Exception ex) when (ex is not OutOfMemoryException)
        {
            throw new StrainFormatException(0, $"dataset '{options.DatasetPath}' cannot be opened: {ex.Message}");
        }

        var samples = dataset.Read<double[]>();
        for (int i = 0; i < samples.Length; i++)
        {
            if (!double.IsFinite(samples[i]))
            {
                throw new StrainFormatException(0, $"sample {i + 1} of '{options.DatasetPath}' is NaN or infinite.");
            }
        }

        if (samples.Length < 2)
        {
            throw new StrainFormatException(0, $"dataset '{options.DatasetPath}' holds {samples.Length} samples; at least 2 are needed.");
        }

        var start = options.Start ?? GpsTime.FromSeconds(ReadScalar(dataset, options.StartAttribute, options.DatasetPath));
        double rate = options.SampleRateHz
            ?? (dataset.AttributeExists(options.RateAttribute)
                ? ReadScalar(dataset, options.RateAttribute, options.DatasetPath)
                : 1.0 / ReadScalar(dataset, options.StepAttribute, options.DatasetPath));
        if (!(rate > 0) || !double.IsFinite(rate))
        {
            throw new StrainFormatException(0, $"sample rate {rate} Hz of '{options.DatasetPath}' is not a positive number.");
        }

        return new TimeSeries(start, rate, samples);
    }

    private static double ReadScalar(IH5Dataset dataset, string name, string datasetPath)
    {
        if (!dataset.AttributeExists(name))
        {
            throw new StrainFormatException(0, $"dataset '{datasetPath}' has no attribute '{name}'; give the value by hand.");
        }

        return dataset.Attribute(name).Read<double>();
    }
}
