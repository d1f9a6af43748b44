using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;

namespace SortRig.Measurement.Settling;

/// <summary>
/// A level-shift (change-point) test on a recovery: the alternative is an offset, one or two exponentials and a step
/// at reading k, over a small set of time constants around the fitted ones (an exponential that half-absorbed a step
/// needs other time constants once the step is explained). The largest drop of the residual sum below the fitted
/// model's is compared with χ²₁ at the Bonferroni level α/n (n positions tried; common practice for a change point
/// of unknown position, no source). A popcorn step that an exponential bends to follow shows here, where a runs
/// test on the residuals may miss it.
/// </summary>
internal static class StepTest
{
    /// <summary>True when a step is significant: the recovery is not the model plus noise.</summary>
    /// <param name="t">Times, s.</param>
    /// <param name="y">Values.</param>
    /// <param name="tauSets">Time constants to try with the step.</param>
    /// <param name="rssToBeat">Residual sum of the fitted model without a step.</param>
    /// <param name="floorVariance">Least variance of one reading (quantisation).</param>
    /// <param name="inflation">Factor for correlated residuals (≥ 1).</param>
    /// <param name="alpha">Significance over all positions.</param>
    public static bool Significant(
        double[] t,
        double[] y,
        IEnumerable<double[]> tauSets,
        double rssToBeat,
        double floorVariance,
        double inflation,
        double alpha
    )
    {
        var n = t.Length;
        if (n < 10)
        {
            return false;
        }

        var yy = y.Sum(v => v * v);
        var (best, parameters) = (double.PositiveInfinity, 0);
        foreach (var taus in tauSets)
        {
            var rss = MinimumWithStep(t, y, taus, yy);
            if (rss < best)
            {
                (best, parameters) = (rss, (2 * taus.Length) + 2);
            }
        }

        // The F-test's denominator is the alternative's own residual variance (the step model explains the data).
        var variance = Math.Max(n > parameters ? best / (n - parameters) : 0, floorVariance) * inflation;
        var threshold = ChiSquared.InvCDF(1, 1 - (alpha / n));
        return variance > 0 && (rssToBeat - best) / variance > threshold;
    }

    internal static double MinimumWithStep(double[] t, double[] y, double[] taus, double yy)
    {
        var n = t.Length;
        var m = taus.Length + 1;
        var rows = new double[n, m];
        var g = Matrix<double>.Build.Dense(m, m);
        var h = Vector<double>.Build.Dense(m);
        for (var i = 0; i < n; i++)
        {
            rows[i, 0] = 1;
            for (var j = 1; j < m; j++)
            {
                rows[i, j] = Math.Exp(-t[i] / taus[j - 1]);
            }

            for (var a = 0; a < m; a++)
            {
                h[a] += rows[i, a] * y[i];
                for (var b = 0; b < m; b++)
                {
                    g[a, b] += rows[i, a] * rows[i, b];
                }
            }
        }

        // Suffix sums give the normal equations with the step column H_k (1 from reading k on) in O(1) per k.
        var suffixRow = new double[m];
        double suffixY = 0,
            count = 0,
            best = double.PositiveInfinity;
        var big = Matrix<double>.Build.Dense(m + 1, m + 1);
        var rhs = Vector<double>.Build.Dense(m + 1);
        for (var k = n - 1; k >= 3; k--)
        {
            for (var a = 0; a < m; a++)
            {
                suffixRow[a] += rows[k, a];
            }

            suffixY += y[k];
            count++;
            if (count < 3)
            {
                continue;
            }

            big.SetSubMatrix(0, 0, g);
            for (var a = 0; a < m; a++)
            {
                big[a, m] = suffixRow[a];
                big[m, a] = suffixRow[a];
                rhs[a] = h[a];
            }

            big[m, m] = count;
            rhs[m] = suffixY;
            var rss = yy - big.Solve(rhs).DotProduct(rhs);
            if (double.IsFinite(rss))
            {
                best = Math.Min(best, Math.Max(0, rss));
            }
        }

        return best;
    }
}
