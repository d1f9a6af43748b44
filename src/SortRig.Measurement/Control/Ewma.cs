namespace SortRig.Measurement.Control;

/// <summary>
/// Exponentially weighted moving average chart (NIST/SEMATECH e-Handbook of Statistical Methods
/// sec. 6.3.2.4): z_i = lambda x_i + (1 - lambda) z_(i-1), z_0 = target; exact time-varying limits
/// target ± L sigma sqrt(lambda / (2 - lambda) · (1 - (1 - lambda)^(2i))), which tend to the
/// handbook's steady-state limits target ± L sigma sqrt(lambda / (2 - lambda)).
/// </summary>
public static class Ewma
{
    /// <summary>The EWMA statistic after each value.</summary>
    /// <param name="values">Values in time order.</param>
    /// <param name="target">Starting value z_0 (the centre).</param>
    /// <param name="lambda">Weight of the newest value, (0, 1].</param>
    public static double[] Statistics(IReadOnlyList<double> values, double target, double lambda)
    {
        ArgumentNullException.ThrowIfNull(values);
        var z = new double[values.Count];
        double previous = target;
        for (int i = 0; i < values.Count; i++)
        {
            previous = (lambda * values[i]) + ((1 - lambda) * previous);
            z[i] = previous;
        }

        return z;
    }

    /// <summary>Half-width of the exact limits at point i (1-based), in the values' unit.</summary>
    /// <param name="i">Point number, &gt;= 1.</param>
    /// <param name="sigma">Sigma of one value.</param>
    /// <param name="options">Lambda and L.</param>
    public static double HalfWidth(int i, double sigma, EwmaOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        ArgumentOutOfRangeException.ThrowIfLessThan(i, 1);
        double lambda = options.Lambda;
        double factor = lambda / (2 - lambda) * (1 - Math.Pow(1 - lambda, 2.0 * i));
        return options.Width * sigma * Math.Sqrt(factor);
    }

    /// <summary>Half-width of the steady-state limits (i → infinity).</summary>
    /// <param name="sigma">Sigma of one value.</param>
    /// <param name="options">Lambda and L.</param>
    public static double SteadyHalfWidth(double sigma, EwmaOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        return options.Width * sigma * Math.Sqrt(options.Lambda / (2 - options.Lambda));
    }
}
