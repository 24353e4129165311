using EventReview.Core.Imports;

namespace EventReview.Core.Environment;

/// <summary>
/// A positive quantity tabulated against frequency: a coupling function (strain per sensor unit) or a sensor's
/// amplitude spectrum (sensor units). Values between points are interpolated linearly in log-frequency and
/// log-value (coupling functions are usually smooth power laws); outside the tabulated range the value is null
/// (no extrapolation).
/// </summary>
public sealed class FrequencyTable
{
    private readonly double[] _frequenciesHz;
    private readonly double[] _values;

    /// <summary>Creates a table from strictly increasing positive frequencies (Hz) and positive values.</summary>
    public FrequencyTable(IReadOnlyList<double> frequenciesHz, IReadOnlyList<double> values)
    {
        ArgumentNullException.ThrowIfNull(frequenciesHz);
        ArgumentNullException.ThrowIfNull(values);
        if (frequenciesHz.Count != values.Count || frequenciesHz.Count == 0)
        {
            throw new ArgumentException("Frequencies and values must be non-empty and of equal length.", nameof(values));
        }

        for (var i = 0; i < frequenciesHz.Count; i++)
        {
            if (!(frequenciesHz[i] > 0) || !double.IsFinite(frequenciesHz[i]) || (i > 0 && frequenciesHz[i] <= frequenciesHz[i - 1]))
            {
                throw new ArgumentOutOfRangeException(nameof(frequenciesHz), frequenciesHz[i], "Frequencies must be positive, finite and strictly increasing.");
            }

            if (!(values[i] > 0) || !double.IsFinite(values[i]))
            {
                throw new ArgumentOutOfRangeException(nameof(values), values[i], "Values must be positive and finite.");
            }
        }

        _frequenciesHz = [.. frequenciesHz];
        _values = [.. values];
    }

    /// <summary>Tabulated frequencies in Hz, increasing.</summary>
    public IReadOnlyList<double> FrequenciesHz => _frequenciesHz;

    /// <summary>Tabulated values.</summary>
    public IReadOnlyList<double> Values => _values;

    /// <summary>Value at a frequency (log-log interpolation), or null outside [first, last] tabulated frequency.</summary>
    public double? At(double frequencyHz)
    {
        if (!(frequencyHz >= _frequenciesHz[0]) || frequencyHz > _frequenciesHz[^1])
        {
            return null;
        }

        var i = Array.BinarySearch(_frequenciesHz, frequencyHz);
        if (i >= 0)
        {
            return _values[i];
        }

        var hi = ~i;
        var lo = hi - 1;
        var t = Math.Log(frequencyHz / _frequenciesHz[lo]) / Math.Log(_frequenciesHz[hi] / _frequenciesHz[lo]);
        return Math.Exp(Math.Log(_values[lo]) + (t * Math.Log(_values[hi] / _values[lo])));
    }

    /// <summary>
    /// Parses CSV with header <c>frequency_hz,&lt;valueColumn&gt;</c> (e.g. "coupling" or "amplitude").
    /// </summary>
    /// <exception cref="CsvFormatException">Naming the line of a bad, non-positive or out-of-order row.</exception>
    public static FrequencyTable Parse(TextReader reader, string valueColumn = "coupling")
    {
        var f = new List<double>();
        var v = new List<double>();
        var rows = CsvTable.Read(reader, "frequency_hz", valueColumn);
        foreach (var row in rows)
        {
            var freq = row.Number("frequency_hz");
            if (freq <= 0 || (f.Count > 0 && freq <= f[^1]))
            {
                throw row.Error("frequency_hz", "frequencies must be positive and strictly increasing");
            }

            var value = row.Number(valueColumn);
            if (value <= 0)
            {
                throw row.Error(valueColumn, "value must be > 0");
            }

            f.Add(freq);
            v.Add(value);
        }

        if (f.Count == 0)
        {
            throw new CsvFormatException(1, null, "the table has no data rows");
        }

        return new FrequencyTable(f, v);
    }
}
