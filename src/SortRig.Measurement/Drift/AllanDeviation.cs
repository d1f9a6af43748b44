using MathNet.Numerics.Distributions;

namespace SortRig.Measurement.Drift;

/// <summary>
/// Overlapping Allan deviation of evenly spaced fractional values y_i (here fractional resistance
/// deviations (R_i - R_ref) / R_ref, treated like fractional-frequency data), per NIST SP 1065
/// (W. J. Riley, Handbook of Frequency Stability Analysis, 2008) sec. 5.2.4, frequency-data form:
/// sigma^2(m tau0) = 1 / (2 m^2 (M - 2m + 1)) * sum_j ( sum_{i=j}^{j+m-1} (y_{i+m} - y_i) )^2.
/// </summary>
public static class AllanDeviation
{
    /// <summary>Probability inside the reported interval (1 sigma, 68.27 %).</summary>
    public const double ConfidenceLevel = 0.682689492137086;

    /// <summary>Overlapping Allan deviation at each averaging factor.</summary>
    /// <param name="fractionalValues">M evenly spaced fractional values (dimensionless), M &gt;= 2, all finite.</param>
    /// <param name="tau0Seconds">Sampling interval, seconds; finite and &gt; 0.</param>
    /// <param name="averagingFactors">Each m must satisfy 1 &lt;= m &lt;= M / 2.</param>
    public static IReadOnlyList<AllanPoint> Overlapping(
        IReadOnlyList<double> fractionalValues,
        double tau0Seconds,
        IEnumerable<int> averagingFactors
    )
    {
        ArgumentNullException.ThrowIfNull(fractionalValues);
        ArgumentNullException.ThrowIfNull(averagingFactors);
        if (!double.IsFinite(tau0Seconds) || tau0Seconds <= 0)
        {
            throw new ArgumentOutOfRangeException(
                nameof(tau0Seconds),
                tau0Seconds,
                "tau0 must be a finite sampling interval > 0 s."
            );
        }

        int count = fractionalValues.Count;
        double[] phase = new double[count + 1];
        for (int i = 0; i < count; i++)
        {
            double y = fractionalValues[i];
            if (!double.IsFinite(y))
            {
                throw new ArgumentException(
                    $"fractionalValues[{i}] must be finite; got {y}.",
                    nameof(fractionalValues)
                );
            }

            phase[i + 1] = phase[i] + y; // running sum: phase in units of tau0 (SP 1065 eq. for x from y)
        }

        var points = new List<AllanPoint>();
        foreach (int m in averagingFactors)
        {
            if (m < 1 || 2 * m > count)
            {
                throw new ArgumentOutOfRangeException(
                    nameof(averagingFactors),
                    m,
                    $"Averaging factor must be within 1..{count / 2} for {count} values."
                );
            }

            points.Add(AtFactor(phase, m, tau0Seconds));
        }

        return points;
    }

    /// <summary>Octave averaging factors 1, 2, 4, ... keeping at least two terms (2m &lt;= M - 1).</summary>
    /// <param name="count">Number of fractional values M, &gt;= 3.</param>
    public static IReadOnlyList<int> OctaveFactors(int count)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(count, 3);
        var factors = new List<int>();
        for (int m = 1; 2 * m <= count - 1; m *= 2)
        {
            factors.Add(m);
        }

        return factors;
    }

    /// <summary>Fractional deviations (R_i - R_ref) / R_ref of resistance readings, dimensionless.</summary>
    /// <param name="ohms">Readings, ohms.</param>
    /// <param name="referenceOhms">Reference, ohms; finite and &gt; 0.</param>
    public static double[] FractionalDeviations(IEnumerable<double> ohms, double referenceOhms)
    {
        ArgumentNullException.ThrowIfNull(ohms);
        if (!double.IsFinite(referenceOhms) || referenceOhms <= 0)
        {
            throw new ArgumentOutOfRangeException(
                nameof(referenceOhms),
                referenceOhms,
                "Reference must be finite and > 0 ohm."
            );
        }

        return ohms.Select(r => (r - referenceOhms) / referenceOhms).ToArray();
    }

    /// <summary>
    /// Equivalent degrees of freedom of the overlapping Allan variance for white frequency noise
    /// (NIST SP 1065 sec. 5.2.x, simple approximation; from memory, checked in tests by Monte Carlo):
    /// edf = [3(N-1)/(2m) - 2(N-2)/N] * 4m^2 / (4m^2 + 5), N = number of phase points = M + 1. Floored at 1.
    /// </summary>
    public static double WhiteFrequencyEdf(int frequencyCount, int m)
    {
        double n = frequencyCount + 1.0;
        double edf = ((3.0 * (n - 1.0) / (2.0 * m)) - (2.0 * (n - 2.0) / n)) * (4.0 * m * m) / ((4.0 * m * m) + 5.0);
        return Math.Max(1.0, edf);
    }

    private static AllanPoint AtFactor(double[] phase, int m, double tau0)
    {
        int count = phase.Length - 1;
        int terms = count - (2 * m) + 1;
        double sum = 0;
        for (int j = 0; j < terms; j++)
        {
            // sum_{i=j}^{j+m-1}(y_{i+m} - y_i) = x_{j+2m} - 2 x_{j+m} + x_j
            double d = phase[j + (2 * m)] - (2.0 * phase[j + m]) + phase[j];
            sum += d * d;
        }

        double variance = sum / (2.0 * m * m * terms);
        double edf = WhiteFrequencyEdf(count, m);
        double tail = (1.0 - ConfidenceLevel) / 2.0;
        double lower = Math.Sqrt(variance * edf / ChiSquared.InvCDF(edf, 1.0 - tail));
        double upper = Math.Sqrt(variance * edf / ChiSquared.InvCDF(edf, tail));
        return new AllanPoint(m, m * tau0, Math.Sqrt(variance), terms, edf, lower, upper);
    }
}
