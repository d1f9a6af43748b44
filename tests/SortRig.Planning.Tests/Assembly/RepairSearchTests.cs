using SortRig.Planning.Assembly;
using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The swap/repair move on the 16-position R-2R ladder (too large for the neighbourhood window): it must never lose a
/// set, never use a part twice, and every set must meet every spec when judged again from the reported parts by the
/// public <see cref="NetworkEvaluator"/> (itself checked against textbook divider formulas and finite differences).
/// </summary>
public sealed class RepairSearchTests
{
    private static readonly Recipe s_ladder = RecipeLoader.Load(
        File.ReadAllText(RepoPaths.Recipe("r2r-dac-8bit.yaml")),
        "r2r-dac-8bit.yaml"
    );

    [Fact]
    public void Ladder_RepairAddsSets_TheSweepMissed_AllValid()
    {
        var gained = 0;
        for (var seed = 0; seed < 3; seed++)
        {
            var rng = new Random(95_000 + seed);
            // Nominals in the ladder's proportion (9 of 20k, 7 of 10k), spread like the benchmark's reels.
            var parts = RandomInstances.Parts(
                rng,
                320,
                [.. Enumerable.Repeat(20e3, 9), .. Enumerable.Repeat(10e3, 7)],
                sigma: 3300e-6,
                maxRelU: 15e-6
            );
            var sweep = new SetAssembler(new AssemblyOptions(timeLimit: TimeSpan.Zero)).Assemble(s_ladder, parts);
            var repaired = new SetAssembler(new AssemblyOptions(timeLimit: TimeSpan.FromSeconds(5))).Assemble(
                s_ladder,
                parts
            );
            Assert.True(
                sweep.Sets.Count < sweep.UpperBound,
                $"seed {seed}: sweep {sweep.Sets.Count} of {sweep.UpperBound}, {sweep.Note}"
            );
            Assert.Equal(AssemblyMethod.Sweep, sweep.Method);
            Assert.Equal(AssemblyMethod.SweepAndRepair, repaired.Method);
            Assert.True(repaired.Sets.Count >= sweep.Sets.Count, $"seed {seed}: repair lost sets");
            Assert.True(repaired.UpperBound >= repaired.Sets.Count);
            AssemblerRefereeTests.AssertSetsValid(s_ladder, parts, repaired, fills => Judge(fills));
            gained += repaired.Sets.Count - sweep.Sets.Count;
        }

        Assert.True(gained > 0, "the repair added no set on any seed");
    }

    internal static double? Judge(IReadOnlyList<(double Value, double U)> fills)
    {
        var names = s_ladder.Positions.Select(p => p.Name).ToList();
        var checks = NetworkEvaluator.Evaluate(
            s_ladder,
            names.Select((n, k) => (n, fills[k].Value)).ToDictionary(t => t.n, t => t.Value),
            names.Select((n, k) => (n, fills[k].U)).ToDictionary(t => t.n, t => t.U)
        );
        return checks.All(c => c.Meets) ? checks.Max(c => c.Score) : null;
    }
}
