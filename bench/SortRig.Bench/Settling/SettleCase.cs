using SortRig.Measurement.Settling;
using SortRig.Simulator.Physics;

namespace SortRig.Bench.Settling;

/// <summary>One benchmark case: a physics model, a reel, the meter's integration time, and the rules to
/// compare.</summary>
internal sealed record SettleCase(
    string Name,
    PhysicsModel Physics,
    ReelSpec Reel,
    double Nplc,
    int Seed,
    IReadOnlyList<(string Name, SettleOptions Options)> Variants
)
{
    /// <summary>0.1 % match, as in the sort verb's default.</summary>
    public const double MatchTolerance = 0.001;

    /// <summary>The 10 kOhm range: every part of a 10 kOhm ±1 % reel reads on it.</summary>
    public const double Range = 10_000;

    /// <summary>The predictive rule as the sort builds it for a long reel (src/SortRig.Engine/Sorting/SortPlan.cs: the
    /// first parts held to teach the reel's prior, <see cref="PredictiveOptions.TeachingFailures"/>).</summary>
    public static PredictiveOptions Predictive { get; } =
        PredictiveOptions.Default with
        {
            TeachingFailures = PredictiveOptions.ReelTeachingFailures,
        };

    /// <summary>The averaging rule as the sort verb builds it (src/SortRig.Engine/Sorting/SortPlan.cs: 4 s settling
    /// span), here measured 4-wire.</summary>
    public static SettleOptions SortOptions(bool fourWire = true) =>
        SettleOptions.Default with
        {
            Target = SettleTarget.Ppm(TargetPpm),
            FourWire = fourWire,
            MaxSettleTime = TimeSpan.FromSeconds(40),
            SettlingSpan = TimeSpan.FromSeconds(4),
        };

    /// <summary>clamp(matchPpm / 200, 0.5, 10) ppm, as SortPlan computes it: 5 ppm for a 0.1 % match.</summary>
    public static double TargetPpm => Math.Clamp(MatchTolerance * 1e6 / 200, 0.5, 10);

    /// <summary>10 kOhm only (the 10 kOhm range), ±1 %, the simulator's default tempco and thermal spreads.</summary>
    public static ReelSpec NormalReel(int parts) => new() { Count = parts, Nominals = [new(10_000, 1)] };

    /// <summary>The same with the centre of the band culled (|d| ≥ 0.5 of the tolerance).</summary>
    public static ReelSpec BimodalReel(int parts) =>
        NormalReel(parts) with
        {
            Distribution = ValueDistribution.Bimodal(0.6, 0.5),
        };

    /// <summary>The eight cases; <paramref name="simpleParts"/> (default <paramref name="parts"/>) for the simple
    /// physics.</summary>
    public static IReadOnlyList<SettleCase> All(
        int parts,
        IReadOnlyList<(string, SettleOptions)> variants,
        int? simpleParts = null
    )
    {
        var cases = new List<SettleCase>();
        var seed = 2026;
        foreach (var physics in new[] { PhysicsModel.Simple, PhysicsModel.Rich })
        {
            var count = physics == PhysicsModel.Simple ? simpleParts ?? parts : parts;
            foreach (var (reelName, reel) in new[] { ("normal", NormalReel(count)), ("bimodal", BimodalReel(count)) })
            {
                foreach (var nplc in new[] { 1.0, 10.0 })
                {
                    var name = FormattableString.Invariant(
                        $"{physics.ToString().ToLowerInvariant()} physics, {reelName} reel, NPLC {nplc:0}"
                    );
                    cases.Add(new SettleCase(name, physics, reel, nplc, seed++, variants));
                }
            }
        }

        return cases;
    }
}
