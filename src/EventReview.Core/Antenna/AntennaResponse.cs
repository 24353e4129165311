namespace EventReview.Core.Antenna;

/// <summary>Antenna pattern values F+ and F× (dimensionless, each in [-1, 1]) of one detector for one direction and polarisation angle.</summary>
public readonly record struct AntennaResponse(double FPlus, double FCross)
{
    /// <summary>F+² + F×², independent of the polarisation angle.</summary>
    public double SumOfSquares => (FPlus * FPlus) + (FCross * FCross);

    /// <summary>
    /// The response at polarisation angle ψ + <paramref name="deltaPsiRadians"/> from the response at ψ:
    /// F+' = F+ cos 2δ - F× sin 2δ, F×' = F+ sin 2δ + F× cos 2δ (follows from the p, q convention of <see cref="AntennaPattern"/>).
    /// </summary>
    public AntennaResponse RotatePolarisation(double deltaPsiRadians)
    {
        var (s, c) = Math.SinCos(2 * deltaPsiRadians);
        return new AntennaResponse((FPlus * c) - (FCross * s), (FPlus * s) + (FCross * c));
    }
}
