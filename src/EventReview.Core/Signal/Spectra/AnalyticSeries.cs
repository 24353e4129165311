namespace EventReview.Core.Signal.Spectra;

/// <summary>
/// An analytic signal z = <see cref="Real"/> + i <see cref="Imaginary"/>, both of the same length: |z| is the envelope and arg z
/// the phase of the original real series.
/// </summary>
/// <param name="Real">The real series itself.</param>
/// <param name="Imaginary">Its Hilbert transform.</param>
public sealed record AnalyticSeries(double[] Real, double[] Imaginary)
{
    /// <summary>Number of samples.</summary>
    public int Length => Real.Length;
}
