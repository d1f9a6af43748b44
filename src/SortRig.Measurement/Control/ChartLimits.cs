namespace SortRig.Measurement.Control;

/// <summary>
/// Limits of an individuals and moving-range chart (moving ranges of two):
/// centre = mean, sigma = MR-bar / d2, UCL/LCL = centre ± 3 sigma, MR chart UCL = D4 · MR-bar, LCL = D3 · MR-bar.
/// </summary>
/// <param name="Centre">Centre line (mean of the history), in the values' unit.</param>
/// <param name="MovingRangeMean">MR-bar, mean of |x_i - x_(i-1)|; 0 when provisional.</param>
/// <param name="Sigma">Estimated sigma of one value (MR-bar / d2, raised to the floor when smaller).</param>
/// <param name="Upper">Upper control limit, centre + 3 sigma.</param>
/// <param name="Lower">Lower control limit, centre - 3 sigma.</param>
/// <param name="MovingRangeUpper">Upper limit of the moving-range chart, D4 · MR-bar (D4 · d2 · sigma when sigma
/// was raised to its floor; infinite when provisional).</param>
/// <param name="MovingRangeLower">Lower limit of the moving-range chart, D3 · MR-bar (0 for n = 2).</param>
/// <param name="HistoryCount">Values the limits were computed from.</param>
public sealed record ChartLimits(
    double Centre,
    double MovingRangeMean,
    double Sigma,
    double Upper,
    double Lower,
    double MovingRangeUpper,
    double MovingRangeLower,
    int HistoryCount
)
{
    /// <summary>Limits from the values' own history (at least two values).</summary>
    /// <param name="history">Values in time order, all finite; at least 2.</param>
    /// <param name="sigmaFloor">Least sigma, same unit; default 0. A history that repeats exactly
    /// would otherwise give zero-width limits.</param>
    public static ChartLimits FromHistory(IReadOnlyList<double> history, double sigmaFloor = 0)
    {
        ArgumentNullException.ThrowIfNull(history);
        if (history.Count < 2)
        {
            throw new ArgumentException("A moving-range chart needs at least 2 values.", nameof(history));
        }

        if (!double.IsFinite(sigmaFloor) || sigmaFloor < 0)
        {
            throw new ArgumentOutOfRangeException(
                nameof(sigmaFloor),
                sigmaFloor,
                "sigmaFloor must be finite and >= 0."
            );
        }

        double sum = 0,
            rangeSum = 0;
        for (int i = 0; i < history.Count; i++)
        {
            double x = history[i];
            if (!double.IsFinite(x))
            {
                throw new ArgumentException($"history[{i}] must be finite; got {x}.", nameof(history));
            }

            sum += x;
            if (i > 0)
            {
                rangeSum += Math.Abs(x - history[i - 1]);
            }
        }

        double centre = sum / history.Count;
        double mrBar = rangeSum / (history.Count - 1);
        double sigma = Math.Max(mrBar / ChartFactors.D2(2), sigmaFloor);

        // A raised sigma raises the moving-range limit with it (MR-bar = d2 sigma), or a step of one floored sigma
        // would fail the moving-range test while inside the individuals limits.
        double mrForLimits = Math.Max(mrBar, ChartFactors.D2(2) * sigma);
        return new ChartLimits(
            centre,
            mrBar,
            sigma,
            centre + (3 * sigma),
            centre - (3 * sigma),
            ChartFactors.BigD4(2) * mrForLimits,
            ChartFactors.BigD3(2) * mrForLimits,
            history.Count
        );
    }

    /// <summary>Provisional limits before there is history: a stated centre and sigma (e.g. the
    /// calibrated value and its standard uncertainty). The moving-range chart is not applied.</summary>
    /// <param name="centre">Centre, finite.</param>
    /// <param name="sigma">Sigma, finite and &gt; 0.</param>
    public static ChartLimits Provisional(double centre, double sigma)
    {
        if (!double.IsFinite(centre))
        {
            throw new ArgumentOutOfRangeException(nameof(centre), centre, "centre must be finite.");
        }

        if (!double.IsFinite(sigma) || sigma <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(sigma), sigma, "sigma must be finite and > 0.");
        }

        return new ChartLimits(
            centre,
            0,
            sigma,
            centre + (3 * sigma),
            centre - (3 * sigma),
            double.PositiveInfinity,
            0,
            0
        );
    }
}
