using SortRig.Measurement.Settling;
using SortRig.Simulator.Physics;

namespace SortRig.Bench.Settling;

/// <summary>One benchmark case: a reel, the meter's integration time, and the adaptive-rule variants to compare.</summary>
internal sealed record SettleCase(string Name, ReelSpec Reel, double Nplc, int Seed, IReadOnlyList<(string Name, SettleOptions Options)> Variants)
{
    /// <summary>0.1 % match, as in the sort verb's default.</summary>
    public const double MatchTolerance = 0.001;

    /// <summary>The 10 kOhm range: every part of a 10 kOhm ±1 % reel reads on it.</summary>
    public const double Range = 10_000;

    /// <summary>The settle options the sort verb uses (src/SortRig.Host/Sorting/SortPlan.cs), here measured 4-wire.</summary>
    public static SettleOptions SortOptions(bool fourWire = true) => SettleOptions.Default with
    {
        Target = SettleTarget.Ppm(TargetPpm),
        FourWire = fourWire,
        MaxSettleTime = TimeSpan.FromSeconds(40),
    };

    /// <summary>clamp(matchPpm / 200, 0.5, 10) ppm, as SortPlan computes it: 5 ppm for a 0.1 % match.</summary>
    public static double TargetPpm => Math.Clamp(MatchTolerance * 1e6 / 200, 0.5, 10);

    /// <summary>10 kOhm only (the 10 kOhm range), ±1 %, the simulator's default tempco and thermal spreads.</summary>
    public static ReelSpec NormalReel(int parts) => new() { Count = parts, Nominals = [new(10_000, 1)] };

    /// <summary>The same with the centre of the band culled (|d| ≥ 0.5 of the tolerance).</summary>
    public static ReelSpec BimodalReel(int parts) => NormalReel(parts) with { Distribution = ValueDistribution.Bimodal(0.6, 0.5) };

    public static IReadOnlyList<SettleCase> All(int parts, IReadOnlyList<(string, SettleOptions)> variants) =>
    [
        new("normal reel, NPLC 1", NormalReel(parts), 1, 2026, variants),
        new("normal reel, NPLC 10", NormalReel(parts), 10, 2027, variants),
        new("bimodal reel, NPLC 1", BimodalReel(parts), 1, 2028, variants),
    ];
}
