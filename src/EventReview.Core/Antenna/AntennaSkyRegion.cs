using EventReview.Core.Geodesy;
using EventReview.Core.Network;
using EventReview.Core.Time;

namespace EventReview.Core.Antenna;

/// <summary>The part of the sky (RA/Dec cells, mean-of-date) where the antenna patterns of two sites allow an observed sign and ratio.</summary>
public static class AntennaSkyRegion
{
    /// <summary>
    /// Cells of <paramref name="cellDegrees"/> × <paramref name="cellDegrees"/> whose centre direction allows the observation
    /// (see <see cref="AntennaConsistency.Allows"/>), at Greenwich mean sidereal time <paramref name="gmstDegrees"/>.
    /// </summary>
    public static IReadOnlyList<SkyCell> AllowedCells(Site a, Site b, AntennaObservation observation, double gmstDegrees,
        double cellDegrees = 5, AntennaConsistencyOptions? options = null)
    {
        if (!double.IsFinite(cellDegrees) || cellDegrees < 0.5 || cellDegrees > 30 || 180 % cellDegrees != 0)
        {
            throw new ArgumentOutOfRangeException(nameof(cellDegrees), cellDegrees, "Cell size must divide 180 and lie in [0.5, 30] degrees.");
        }

        var tensorA = SiteGeometry.Tensor(a);
        var tensorB = SiteGeometry.Tensor(b);
        var cells = new List<SkyCell>();
        var rows = (int)Math.Round(180 / cellDegrees);
        for (var row = 0; row < rows; row++)
        {
            var dec = -90 + ((row + 0.5) * cellDegrees);
            for (var col = 0; col < 2 * rows; col++)
            {
                var ra = (col + 0.5) * cellDegrees;
                var n = SkyFrame.ToEcef(ra, dec, gmstDegrees);
                if (AntennaConsistency.Allows(tensorA, tensorB, n, observation, options))
                {
                    cells.Add(new SkyCell(ra, dec, cellDegrees, cellDegrees));
                }
            }
        }

        return cells;
    }
}
