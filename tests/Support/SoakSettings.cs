using System.Globalization;

namespace SortRig.Tests.Support;

/// <summary>
/// Size of a fault soak. The in-test defaults are moderate (at least 500 parts and 1 000 faults);
/// scripts/soak sets SORTRIG_SOAK_* to run longer or harder, and SORTRIG_SOAK_REPORT to collect the figures.
/// </summary>
/// <param name="Parts">Reel length (SORTRIG_SOAK_PARTS).</param>
/// <param name="FaultRate">Faults per exchange over all five kinds (SORTRIG_SOAK_RATE), 0 to 0.5.</param>
/// <param name="Speed">Virtual time runs this many times faster (SORTRIG_SOAK_SPEED).</param>
/// <param name="Seed">Seed of reel, noise and faults (SORTRIG_SOAK_SEED).</param>
/// <param name="LinkCutEvery">Serial only: the cable is pulled about this often, wall time
/// (SORTRIG_SOAK_CUT_S).</param>
internal sealed record SoakSettings(int Parts, double FaultRate, double Speed, int Seed, TimeSpan LinkCutEvery)
{
    public static SoakSettings FromEnvironment(int parts, double faultRate, double speed, int seed) =>
        new(
            Int("SORTRIG_SOAK_PARTS") ?? parts,
            Number("SORTRIG_SOAK_RATE") ?? faultRate,
            Number("SORTRIG_SOAK_SPEED") ?? speed,
            Int("SORTRIG_SOAK_SEED") ?? seed,
            TimeSpan.FromSeconds(Number("SORTRIG_SOAK_CUT_S") ?? 2)
        )
        {
            IsSuiteSize = Int("SORTRIG_SOAK_PARTS") is null && Number("SORTRIG_SOAK_RATE") is null,
        };

    /// <summary>The reel length and fault rate are the test suite's own (not set by scripts/soak).</summary>
    public bool IsSuiteSize { get; init; }

    /// <summary>Appends one line to the file named by SORTRIG_SOAK_REPORT, when set.</summary>
    public static void Report(string line)
    {
        if (Environment.GetEnvironmentVariable("SORTRIG_SOAK_REPORT") is { Length: > 0 } path)
        {
            File.AppendAllLines(path, [line]);
        }
    }

    private static int? Int(string name) =>
        int.TryParse(
            Environment.GetEnvironmentVariable(name),
            NumberStyles.Integer,
            CultureInfo.InvariantCulture,
            out var v
        )
            ? v
            : null;

    private static double? Number(string name) =>
        double.TryParse(
            Environment.GetEnvironmentVariable(name),
            NumberStyles.Float,
            CultureInfo.InvariantCulture,
            out var v
        )
            ? v
            : null;
}
