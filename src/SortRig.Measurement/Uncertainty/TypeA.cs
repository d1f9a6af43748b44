using MathNet.Numerics.Statistics;

namespace SortRig.Measurement.Uncertainty;

/// <summary>
/// Type A evaluation of standard uncertainty: statistical analysis of repeated observations
/// (JCGM 100:2008 sec. 4.2).
/// </summary>
public static class TypeA
{
    /// <summary>
    /// Experimental standard deviation of the mean s(q̄) = s(q) / √n (JCGM 100:2008 eq. 5),
    /// in the unit of the values.
    /// </summary>
    /// <param name="values">At least two finite observations.</param>
    /// <exception cref="ArgumentException">Fewer than two values, or a value is not finite.</exception>
    public static double StandardUncertaintyOfMean(IReadOnlyList<double> values)
    {
        ArgumentNullException.ThrowIfNull(values);
        if (values.Count < 2)
        {
            throw new ArgumentException(
                $"Type A needs at least 2 observations to estimate a standard deviation; got {values.Count}.",
                nameof(values)
            );
        }

        for (var i = 0; i < values.Count; i++)
        {
            if (!double.IsFinite(values[i]))
            {
                throw new ArgumentException(
                    $"Observation {i} is {values[i]}; every observation must be finite.",
                    nameof(values)
                );
            }
        }

        return values.StandardDeviation() / Math.Sqrt(values.Count);
    }

    /// <summary>
    /// A budget component for the mean of the observations: u = s/√n, ν = n − 1 (JCGM 100:2008 G.3.3).
    /// </summary>
    /// <param name="name">Name shown in the budget.</param>
    /// <param name="values">At least two finite observations.</param>
    /// <param name="sensitivity">Sensitivity coefficient c_i; default 1.</param>
    public static BudgetComponent Component(string name, IReadOnlyList<double> values, double sensitivity = 1.0) =>
        new(name, StandardUncertaintyOfMean(values), sensitivity, values.Count - 1, UncertaintyKind.TypeA);
}
