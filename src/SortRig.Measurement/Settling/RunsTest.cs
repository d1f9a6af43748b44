using MathNet.Numerics.Distributions;

namespace SortRig.Measurement.Settling;

/// <summary>
/// Wald-Wolfowitz runs test on the signs of residuals (Wald and Wolfowitz 1940; NIST/SEMATECH e-Handbook of
/// Statistical Methods sec. 1.3.5.13, from memory): with n₁ positive and n₂ negative residuals and R runs,
/// μ = 2n₁n₂/N + 1, σ² = 2n₁n₂(2n₁n₂ − N) / (N²(N − 1)), z = (R − μ)/σ. Too few runs (z very negative) means the
/// residuals wander together: the model misses a shape in the data, or the noise is not white.
/// </summary>
internal static class RunsTest
{
    /// <summary>The z statistic; 0 when there are too few residuals of either sign to judge.</summary>
    public static double Z(ReadOnlySpan<double> residuals)
    {
        int positive = 0,
            negative = 0,
            runs = 0;
        var last = 0;
        foreach (var r in residuals)
        {
            var sign =
                r > 0 ? 1
                : r < 0 ? -1
                : 0;
            if (sign == 0)
            {
                continue;
            }

            _ = sign > 0 ? positive++ : negative++;
            if (sign != last)
            {
                runs++;
                last = sign;
            }
        }

        var n = positive + negative;
        if (positive < 2 || negative < 2)
        {
            // all of one sign over many points: no noise around the model
            return positive + negative >= 10 ? double.NegativeInfinity : 0;
        }

        var product = 2.0 * positive * negative;
        var mean = (product / n) + 1;
        var variance = product * (product - n) / ((double)n * n * (n - 1));
        return variance > 0 ? (runs - mean) / Math.Sqrt(variance) : 0;
    }

    /// <summary>True when the residuals pass at one-sided significance <paramref name="alpha"/> (reject only too few
    /// runs).</summary>
    public static bool LooksWhite(ReadOnlySpan<double> residuals, double alpha) =>
        Z(residuals) >= Normal.InvCDF(0, 1, alpha);
}
