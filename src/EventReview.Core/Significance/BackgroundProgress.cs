namespace EventReview.Core.Significance;

/// <summary>Progress of a background estimate.</summary>
/// <param name="SlidesDone">Slides finished; for the fast finder, which works through all slides at once, the equivalent share of the 2K slides.</param>
/// <param name="SlidesTotal">2K.</param>
/// <param name="CoincidencesFound">Background coincidences found so far.</param>
public readonly record struct BackgroundProgress(int SlidesDone, int SlidesTotal, long CoincidencesFound)
{
    /// <summary>Fraction done in [0, 1].</summary>
    public double Fraction => SlidesTotal == 0 ? 1.0 : SlidesDone / (double)SlidesTotal;
}
