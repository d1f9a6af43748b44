namespace SortRig.Reporting.Plots;

/// <summary>What to draw on a check standard's individuals chart.</summary>
/// <param name="CheckName">The check's name, for the title.</param>
/// <param name="ValuesOhms">The check's values on the session's scale, ohms, in order; at least one, all
/// finite.</param>
/// <param name="OutOfControl">For each value, true when the chart put it out of control; same length.</param>
/// <param name="CentreOhms">Centre line, ohms.</param>
/// <param name="SigmaOhms">Sigma, ohms; &gt; 0. Limits are drawn at centre ± 3 sigma.</param>
public sealed record ControlChartInput(
    string CheckName,
    IReadOnlyList<double> ValuesOhms,
    IReadOnlyList<bool> OutOfControl,
    double CentreOhms,
    double SigmaOhms
);

/// <summary>The numbers behind a control chart: each point in ppm of the centre and the limits drawn.</summary>
/// <param name="PointsPpm">Each value's deviation from the centre, ppm.</param>
/// <param name="UpperPpm">Upper control limit, ppm of the centre (+3 sigma).</param>
/// <param name="LowerPpm">Lower control limit, ppm of the centre (-3 sigma).</param>
public sealed record ControlChartData(double[] PointsPpm, double UpperPpm, double LowerPpm);
