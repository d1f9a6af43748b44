namespace SortRig.Planning.Networks;

/// <summary>Two-resistor combinations and their first derivatives (for uncertainty propagation).</summary>
public static class SeriesParallel
{
    /// <summary>R1 + R2, ohms.</summary>
    public static double Series(double r1, double r2) => r1 + r2;

    /// <summary>R1 R2 / (R1 + R2), ohms.</summary>
    public static double Parallel(double r1, double r2) => r1 * r2 / (r1 + r2);

    /// <summary>∂(R1 ∥ R2)/∂R1 = (R2 / (R1 + R2))², dimensionless.</summary>
    public static double ParallelDerivative(double r1, double r2)
    {
        var f = r2 / (r1 + r2);
        return f * f;
    }

    /// <summary>Worst-case (linear) expanded uncertainty of a combination from the parts' expanded uncertainties,
    /// ohms.</summary>
    /// <param name="parallel">True for parallel, false for series.</param>
    /// <param name="r1">First part, ohms.</param>
    /// <param name="u1">First part's expanded uncertainty, ohms.</param>
    /// <param name="r2">Second part, ohms.</param>
    /// <param name="u2">Second part's expanded uncertainty, ohms.</param>
    public static double WorstCaseUncertainty(bool parallel, double r1, double u1, double r2, double u2) =>
        parallel ? (ParallelDerivative(r1, r2) * u1) + (ParallelDerivative(r2, r1) * u2) : u1 + u2;
}
