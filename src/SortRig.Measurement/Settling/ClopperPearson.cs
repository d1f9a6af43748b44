using MathNet.Numerics.Distributions;

namespace SortRig.Measurement.Settling;

/// <summary>Exact (Clopper-Pearson, 1934) one-sided upper confidence bound of a binomial proportion: what a settle
/// rule's false-accept rate is bounded by, from its count of false accepts in a number of accepted parts.</summary>
public static class ClopperPearson
{
    /// <summary>The upper bound p_U with P(X ≤ x | n, p_U) = 1 − confidence: the confidence quantile of Beta(x + 1, n −
    /// x).</summary>
    public static double Upper(int failures, int trials, double confidence = 0.95)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(failures);
        ArgumentOutOfRangeException.ThrowIfLessThan(trials, failures);
        if (trials == 0 || failures == trials)
        {
            return 1.0;
        }

        // x = 0 has the closed form 1 − (1 − confidence)^(1/n) ("rule of three": about 3/n at 95 %).
        return failures == 0
            ? 1 - Math.Pow(1 - confidence, 1.0 / trials)
            : Beta.InvCDF(failures + 1, trials - failures, confidence);
    }
}
