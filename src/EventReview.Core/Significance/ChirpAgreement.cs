namespace EventReview.Core.Significance;

/// <summary>The optional chirp-mass consistency cut between two triggers.</summary>
public static class ChirpAgreement
{
    /// <summary>
    /// True when |m1 - m2| &lt;= tol x (m1 + m2) / 2, or when either chirp mass or the tolerance is NaN
    /// (absent: no cut). Masses in solar masses; tolerance relative (0.1 = 10 %).
    /// </summary>
    public static bool Agrees(double chirpMassA, double chirpMassB, double relativeTolerance)
    {
        if (double.IsNaN(relativeTolerance) || double.IsNaN(chirpMassA) || double.IsNaN(chirpMassB))
        {
            return true;
        }

        return Math.Abs(chirpMassA - chirpMassB) <= relativeTolerance * 0.5 * (chirpMassA + chirpMassB);
    }
}
