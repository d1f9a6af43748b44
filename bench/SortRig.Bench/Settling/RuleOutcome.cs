namespace SortRig.Bench.Settling;

/// <summary>What one rule did with one insertion. Errors and uncertainties are in ppm of the part's true
/// value.</summary>
/// <param name="Accepted">True when the rule gave a value (false: declared unstable).</param>
/// <param name="Seconds">From contact to the end of the deciding reading.</param>
/// <param name="Readings">Readings the meter took for the decision (see docs/bench-settle.md for each rule).</param>
/// <param name="ErrorPpm">Accepted value minus the simulator's truth; NaN when not accepted or not measured.</param>
/// <param name="ExpandedTransferPpm">The rule's stated expanded transfer uncertainty U (k = 2); NaN when none.</param>
/// <param name="ExpandedAbsolutePpm">The rule's stated expanded absolute uncertainty U (k = 2); NaN when none.</param>
/// <param name="Predicted">True when the predictive rule (not the averaging fallback) accepted.</param>
internal sealed record RuleOutcome(
    bool Accepted,
    double Seconds,
    int Readings,
    double ErrorPpm,
    double ExpandedTransferPpm,
    double ExpandedAbsolutePpm,
    bool Predicted = false
)
{
    public static RuleOutcome Measured(
        double seconds,
        int readings,
        double value,
        double expandedTransfer,
        double expandedAbsolute,
        double truth
    ) =>
        new(
            true,
            seconds,
            readings,
            Ppm(value - truth, truth),
            Ppm(expandedTransfer, truth),
            Ppm(expandedAbsolute, truth)
        );

    public static RuleOutcome Timed(double seconds, int readings) =>
        new(true, seconds, readings, double.NaN, double.NaN, double.NaN);

    public static RuleOutcome Unstable(double seconds, int readings) =>
        new(false, seconds, readings, double.NaN, double.NaN, double.NaN);

    private static double Ppm(double ohms, double truth) => ohms / truth * 1e6;
}
