namespace SortRig.Measurement.Settling;

/// <summary>
/// Variance inflation of correlated residuals read by batch means (the blocking method: Flyvbjerg and Petersen
/// 1989; batch means, Schmeiser 1982; from memory): the residuals are cut into consecutive blocks of m readings and
/// m times the mean square of the block means, over the white-noise variance, is the factor by which the variance of
/// any smooth linear functional of the data (such as an extrapolated asymptote) exceeds its white-noise value. The
/// lag-one factor (1 + ρ)/(1 − ρ) reads the correlation at one reading only: on a bench where the meter's white noise
/// dominates each reading, a 1/f-like excess noise of the part barely moves ρ, yet it wanders by a fraction of a ppm
/// over the seconds an extrapolation leans on. Blocks see it at that scale.
/// </summary>
internal static class BatchMeans
{
    /// <summary>
    /// The inflation factor (≥ 0; about 1 for white residuals, larger when they wander) of residuals in time order,
    /// blocks of <paramref name="blockLength"/> readings taken from the newest backwards (a leftover at the start is
    /// left out); NaN when fewer than <paramref name="parameters"/> + 4 blocks fit. The block means of a model's
    /// residuals lose about one degree of freedom per fitted parameter (the model columns are smooth, so they lie
    /// almost wholly in the span of the block means): the mean square divides by (blocks − parameters).
    /// </summary>
    /// <param name="residuals">Residuals in time order.</param>
    /// <param name="blockLength">Readings per block, ≥ 2.</param>
    /// <param name="parameters">Parameters of the fitted model.</param>
    /// <param name="whiteVariance">Variance of one residual (RSS over its degrees of freedom).</param>
    public static double Inflation(
        ReadOnlySpan<double> residuals,
        int blockLength,
        int parameters,
        double whiteVariance
    )
    {
        var blocks = residuals.Length / blockLength;
        if (blockLength < 2 || blocks < parameters + 4 || !(whiteVariance > 0))
        {
            return double.NaN;
        }

        var sum = 0.0;
        for (var b = 0; b < blocks; b++)
        {
            var end = residuals.Length - (b * blockLength);
            var mean = 0.0;
            for (var i = end - blockLength; i < end; i++)
            {
                mean += residuals[i];
            }

            mean /= blockLength;
            sum += mean * mean;
        }

        return blockLength * sum / (blocks - parameters) / whiteVariance;
    }
}
