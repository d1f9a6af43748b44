using SortRig.Engine.DriftLogging;
using SortRig.Measurement.Drift;
using SortRig.Storage.Contracts;

namespace SortRig.Host.LibraryVerb;

/// <summary>What a library part's latest drift run showed (the run's own analysis, <see
/// cref="DriftRunAnalysis"/>).</summary>
/// <param name="RunId">Drift run id (for <c>sortrig report --drift-run</c>).</param>
/// <param name="RunName">Run name.</param>
/// <param name="HoursLogged">First to last sample of the part's channel, hours.</param>
/// <param name="Samples">Samples of the part's channel.</param>
/// <param name="PpmPerHour">Drift, ppm of the channel mean per hour (least-squares line); null below 3 samples or one
/// time.</param>
/// <param name="TempcoPpmPerKelvin">Tempco of the joint fit (drift and temperature together), ppm/K; null without
/// temperatures or when the fit is refused (constant temperature, temperature following time).</param>
/// <param name="Adev">Overlapping Allan deviation at the longest reliable averaging time (<see
/// cref="LibraryDrift.ReliableEdf"/>); null when none.</param>
internal sealed record PartDrift(
    long RunId,
    string RunName,
    double HoursLogged,
    long Samples,
    double? PpmPerHour,
    double? TempcoPpmPerKelvin,
    AllanPoint? Adev
)
{
    /// <summary>Figures from one channel's analysis.</summary>
    public static PartDrift From(PartDriftRun run, DriftChannelResult result) =>
        new(
            run.RunId,
            run.RunName,
            run.HoursLogged,
            run.SampleCount,
            result.Drift?.PpmPerHour.Value,
            result.Joint?.PpmPerKelvin.Value,
            result.Adev.LastOrDefault(p => p.DegreesOfFreedom >= LibraryDrift.ReliableEdf)
        );
}
