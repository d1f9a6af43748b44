using SortRig.Measurement.Drift;

namespace SortRig.Reporting.Plots;

/// <summary>What to draw for one drift channel.</summary>
/// <param name="Channel">Channel name shown in the title.</param>
/// <param name="Samples">Logged samples, at least one; temperature drawn where present.</param>
/// <param name="ReferenceOhms">Resistance the ppm refer to, ohms; finite and &gt; 0 (the channel mean in
/// reports).</param>
/// <param name="Fit">Fitted drift line to overlay, or null.</param>
public sealed record DriftPlotInput(
    string Channel,
    IReadOnlyList<DriftSample> Samples,
    double ReferenceOhms,
    DriftFit? Fit = null
);

/// <summary>The points behind a drift plot.</summary>
/// <param name="Origin">Time of the earliest sample; hours count from here.</param>
/// <param name="Hours">Elapsed time of each resistance point, hours, in input order.</param>
/// <param name="Ppm">Deviation of each point from the reference, ppm.</param>
/// <param name="TemperatureHours">Elapsed time of each temperature point, hours.</param>
/// <param name="TemperatureC">Temperature points on the right axis, degC.</param>
public sealed record DriftPlotData(
    DateTimeOffset Origin,
    double[] Hours,
    double[] Ppm,
    double[] TemperatureHours,
    double[] TemperatureC
);
