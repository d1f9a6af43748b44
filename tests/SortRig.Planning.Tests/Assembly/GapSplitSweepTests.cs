using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The sweep split at the widest gap in z (recipes whose sets are too large for the neighbourhood window). Referees:
/// the public <see cref="NetworkEvaluator"/> (itself checked against textbook divider formulas and finite
/// differences) for the R-2R ladder, and on small instances the independent brute force (<see
/// cref="BruteForce.Solve"/>, every partition of the parts) for the optimum and its judges for every set.
/// </summary>
public sealed class GapSplitSweepTests
{
    private static readonly Recipe s_ladder = RecipeLoader.Load(
        File.ReadAllText(RepoPaths.Recipe("r2r-dac-8bit.yaml")),
        "r2r-dac-8bit.yaml"
    );

    [Fact]
    public void Ladder_ReelWithAHole_SplitSetsMeetEverySpec_NoPartTwice()
    {
        for (var seed = 0; seed < 4; seed++)
        {
            // Nominals in the ladder's proportion (9 of 20k, 7 of 10k); no part within 0.4 % of nominal.
            var parts = Bimodal(
                new Random(96_000 + seed),
                600,
                [.. Enumerable.Repeat(20e3, 9), .. Enumerable.Repeat(10e3, 7)],
                hole: 4000e-6,
                sigma: 4000e-6,
                maxRelU: 15e-6
            );
            var options = new AssemblyOptions();
            var pool = new CandidatePool(s_ladder, parts, options, withPairs: false);
            var split = GapSplitSweep.Run(s_ladder, pool, new NetworkRule(s_ladder), options);
            Assert.NotNull(split);
            Assert.True(split.Value.Low < 0 && split.Value.High > 0, "the widest gap is not the hole");
            var used = new HashSet<int>();
            foreach (var (fills, _) in split.Value.Sets)
            {
                Assert.All(fills, f => Assert.True(used.Add(f.A) && (f.B < 0 || used.Add(f.B)), "part used twice"));
                var values = s_ladder.Positions.Select((p, k) => (p.Name, Value(pool.Usable, fills[k]))).ToDictionary();
                var u = s_ladder.Positions.Select((p, k) => (p.Name, U(pool.Usable, fills[k]))).ToDictionary();
                Assert.All(NetworkEvaluator.Evaluate(s_ladder, values, u), c => Assert.True(c.Meets, c.Name));
            }

            var result = new SetAssembler().Assemble(s_ladder, parts);
            Assert.True(result.UpperBound >= Math.Max(result.Sets.Count, split.Value.Sets.Count));
            AssemblerRefereeTests.AssertSetsValid(s_ladder, parts, result, RepairSearchTests.Judge);
        }
    }

    [Fact]
    public void SmallInstancesWithAHole_NeverAboveTheBruteForceOptimum()
    {
        // Windows one part short of two sets, so the assembler takes the split and the swap/repair path.
        var taken = 0;
        for (var c = 0; c < 120; c++)
        {
            var shape = 3 + (c % 3);
            var recipe = RandomInstances.Matched(shape);
            var parts = Bimodal(new Random(97_000 + c), 10, ReelScaleReferee.Nominals(recipe), 500e-6, 800e-6, 100e-6);
            var result = ReelScaleReferee.Check(
                recipe,
                parts,
                BruteForce.Matched(recipe),
                (2 * recipe.Positions.Count) - 1,
                $"case {c}"
            );
            taken += result.Note.Contains("split at the widest gap", StringComparison.Ordinal) ? 1 : 0;
        }

        Assert.True(taken > 0, "no instance kept the split plan");
    }

    // A pair's value and uncertainty from its parts (series: sums; the ladder allows series pairs only).
    private static double Value(IReadOnlyList<PartCandidate> parts, Option o) =>
        parts[o.A].Value.Value + (o.B >= 0 ? parts[o.B].Value.Value : 0);

    private static double U(IReadOnlyList<PartCandidate> parts, Option o) =>
        parts[o.A].Value.ExpandedTransfer + (o.B >= 0 ? parts[o.B].Value.ExpandedTransfer : 0);

    // Deviations N(0, σ) kept only with hole ≤ |d| ≤ 2.5 σ (rejection sampling): stock with the tighter grade
    // sorted out, the reel still within its tolerance.
    private static List<PartCandidate> Bimodal(
        Random rng,
        int count,
        double[] nominals,
        double hole,
        double sigma,
        double maxRelU
    ) =>
        Enumerable
            .Range(0, count)
            .Select(i =>
            {
                var n = nominals[rng.Next(nominals.Length)];
                double d;
                do
                {
                    var g = Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
                    d = sigma * g;
                } while (Math.Abs(d) < hole || Math.Abs(d) > 2.5 * sigma);

                var v = n * (1 + d);
                var u = v * rng.NextDouble() * maxRelU;
                return new PartCandidate(i + 1, n, new MeasuredValue(v, u, u / 2), $"T1-A{i + 1:00}");
            })
            .ToList();
}
