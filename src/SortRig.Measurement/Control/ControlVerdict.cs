namespace SortRig.Measurement.Control;

/// <summary>The chart's verdict on the newest point.</summary>
/// <param name="InControl">True when no test fired.</param>
/// <param name="Rule">The first test that fired (checked in the order of <see cref="ControlChart.Judge"/>), or
/// None.</param>
/// <param name="Reason">Plain words for the operator; empty when in control.</param>
/// <param name="Value">The point judged, in the values' unit.</param>
/// <param name="SigmaScore">(value - centre) / sigma.</param>
/// <param name="EwmaValue">The EWMA statistic after the point.</param>
/// <param name="EwmaHalfWidth">Half-width of the EWMA limits at the point.</param>
public sealed record ControlVerdict(
    bool InControl,
    ControlRule Rule,
    string Reason,
    double Value,
    double SigmaScore,
    double EwmaValue,
    double EwmaHalfWidth
);
