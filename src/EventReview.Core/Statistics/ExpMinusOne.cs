namespace EventReview.Core.Statistics;

/// <summary>exp(x) - 1 without the cancellation of the direct formula for small |x|.</summary>
public static class ExpMinusOne
{
    // Kahan's trick: (u - 1) x / ln u with u = exp(x) (Higham 2002, "Accuracy and Stability of Numerical Algorithms", sec. 1.14.1).

    /// <summary>exp(x) - 1, accurate to a few ulps for every finite x (also for |x| below 1e-10).</summary>
    public static double Of(double x)
    {
        var u = Math.Exp(x);
        if (u == 1.0)
        {
            return x;
        }

        var um1 = u - 1.0;
        if (um1 == -1.0)
        {
            return -1.0;
        }

        return double.IsInfinity(u) ? u : um1 * x / Math.Log(u);
    }
}
