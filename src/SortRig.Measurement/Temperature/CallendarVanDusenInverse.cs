namespace SortRig.Measurement.Temperature;

/// <summary>Inverse of the Callendar-Van Dusen relation, T(R).</summary>
internal static class CallendarVanDusenInverse
{
    private const int MaxIterations = 50;
    private const double ToleranceCelsius = 1e-10;

    public static double Solve(CallendarVanDusen cvd, double ohms)
    {
        // Accept 0.01 % of R0 beyond the range ends so that rounded table values and reading noise at
        // -200 / 850 degC still convert (they extrapolate the polynomial by under 0.03 K).
        double margin = 1e-4 * cvd.R0;
        double low = (cvd.R0 * cvd.Ratio(CallendarVanDusen.MinimumCelsius)) - margin;
        double high = (cvd.R0 * cvd.Ratio(CallendarVanDusen.MaximumCelsius)) + margin;
        if (!double.IsFinite(ohms) || ohms < low || ohms > high)
        {
            throw new ArgumentOutOfRangeException(
                nameof(ohms),
                ohms,
                $"Resistance must be within {low:G6}..{high:G6} ohm (R0 = {cvd.R0} ohm over -200..850 degC, plus "
                    + $"0.01 % of R0)."
            );
        }

        double quadratic = Quadratic(cvd, ohms / cvd.R0);
        return ohms >= cvd.R0 ? quadratic : Newton(cvd, ohms / cvd.R0, quadratic);
    }

    /// <summary>Root of 1 + A t + B t^2 = W that is near 0 degC (the other root is near +6800 degC).</summary>
    private static double Quadratic(CallendarVanDusen cvd, double ratio)
    {
        double discriminant = (cvd.A * cvd.A) - (4.0 * cvd.B * (1.0 - ratio));
        return (-cvd.A + Math.Sqrt(discriminant)) / (2.0 * cvd.B);
    }

    /// <summary>Newton iteration on the full polynomial below 0 degC, seeded with the quadratic root.</summary>
    private static double Newton(CallendarVanDusen cvd, double ratio, double start)
    {
        double t = start;
        for (int i = 0; i < MaxIterations; i++)
        {
            double step = (cvd.Ratio(t) - ratio) / cvd.RatioSlope(t);
            t -= step;
            if (Math.Abs(step) < ToleranceCelsius)
            {
                return t;
            }
        }

        throw new InvalidOperationException(
            $"Callendar-Van Dusen inverse did not converge for R/R0 = {ratio:R} within {MaxIterations} iterations."
        );
    }
}
