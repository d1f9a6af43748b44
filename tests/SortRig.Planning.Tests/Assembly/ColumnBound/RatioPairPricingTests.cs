using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Assembly.ColumnBound;
using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly.ColumnBound;

/// <summary>
/// The column LP's pricing for networks whose outputs depend on two position ratios (<see cref="RatioPairPricing"/>)
/// on instances small enough for referees: the scale-invariance detection (<see cref="ScalePairs"/>) against the
/// textbook difference amplifier; its family holds every set the independent brute force finds feasible; its bound is
/// never below the exact optimum; its certificate is dual feasible over those sets; and when it converges it is the LP
/// of the enumerated pricing (both are the set-packing LP over every feasible set; LP duality, textbook; the rounding
/// Farley 1990, from memory).
/// </summary>
public sealed class RatioPairPricingTests
{
    private static readonly AssemblyOptions Defaults = new();

    private static Recipe Load(string file) => RecipeLoader.Load(File.ReadAllText(RepoPaths.Recipe(file)), file);

    private static readonly Recipe s_g10 = Load("diff-amp-g10.yaml");
    private static readonly Recipe s_g1 = Load("diff-amp-g1.yaml");

    // Four resistors in a string with two taps: every ratio of the string matters, so no pair is scale-invariant.
    private static readonly Recipe s_string = RecipeLoader.Load(
        "recipe: string4\nform: network\nground: gnd\nsources:\n  - { name: V1, plus: in, minus: gnd, volts: 10 }\n"
            + "positions:\n  - { name: R1, nominal: 10k, between: [in, a] }\n"
            + "  - { name: R2, nominal: 10k, between: [a, b] }\n  - { name: R3, nominal: 10k, between: [b, c] }\n"
            + "  - { name: R4, nominal: 10k, between: [c, gnd] }\noutputs:\n"
            + "  - { name: tap-a, kind: voltage-ratio, numerator: a, denominator: in, tolerance-ppm: 300 }\n"
            + "  - { name: tap-c, kind: voltage-ratio, numerator: c, denominator: in, tolerance-ppm: 300 }\n",
        "string4.yaml"
    );

    [Theory]
    [InlineData("diff-amp-g10.yaml", 10.0)]
    [InlineData("diff-amp-g1.yaml", 1.0)]
    public void Detection_DifferenceAmplifiers_PairsR1R2AndR3R4(string file, double gain)
    {
        var recipe = Load(file);
        var network = new RecipeNetwork(recipe);
        Assert.Equal((0, 1, 2, 3), ScalePairs.Find(network, [.. recipe.Positions.Select(p => p.Nominal)]));
        Assert.True(RatioPairPricing.Applies(recipe));

        // Textbook (ideal op-amp difference amplifier): with R4/R3 = R2/R1 = G the differential gain is G and the
        // common-mode output 0, whatever the two pairs' scales; with b = R4/R3 off, the common-mode output per volt is
        // (b − a) / (1 + b) (superposition of the inverting and non-inverting gains, textbook).
        var r1 = recipe.Positions[0].Nominal;
        foreach (var (s, t) in new[] { (1.0, 1.0), (0.37, 2.9), (5.0, 0.2) })
        {
            var outs = network.Evaluate([r1 * s, r1 * gain * s, r1 * t, r1 * gain * t]);
            Assert.Equal(gain, outs[0].Value, 9);
            Assert.Equal(0, outs[1].Value, 12);
        }

        var b = gain * 1.001;
        var off = network.Evaluate([r1 * 3, r1 * gain * 3, r1, r1 * b]);
        Assert.Equal((b - gain) / (1 + b), off[1].Value, 12);
    }

    [Theory]
    [InlineData("decade-divider.yaml")]
    [InlineData("r2r-dac-8bit.yaml")]
    [InlineData("matched-quad.yaml")]
    public void Detection_OtherRecipes_No(string file) => Assert.False(RatioPairPricing.Applies(Load(file)));

    [Fact]
    public void Detection_FourResistorString_NoPairing()
    {
        // Four positions, but scaling any two of a string changes its taps (voltage division, textbook).
        var network = new RecipeNetwork(s_string);
        Assert.Null(ScalePairs.Find(network, [10e3, 10e3, 10e3, 10e3]));
        Assert.False(RatioPairPricing.Applies(s_string));
    }

    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 8));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void GainTen_Normal(int seed) =>
        Check(s_g10, RandomInstances.Parts(new Random(97_000 + seed), 14, [1e3, 10e3], 400e-6, 20e-6), seed);

    [Theory]
    [MemberData(nameof(Seeds))]
    public void GainTen_Bimodal(int seed) =>
        Check(s_g10, Bimodal(new Random(97_500 + seed), 14, [1e3, 10e3], 600e-6), seed);

    [Theory]
    [MemberData(nameof(Seeds))]
    public void GainOne_Normal(int seed) =>
        // Wider than the gain-ten instances: at gain one (four parts of one nominal) σ 400 ppm made every block a set.
        Check(s_g1, RandomInstances.Parts(new Random(98_000 + seed), 12, [10e3], 1000e-6, 20e-6), seed);

    [Theory]
    [MemberData(nameof(Seeds))]
    public void GainOne_Bimodal(int seed) => Check(s_g1, Bimodal(new Random(98_500 + seed), 12, [10e3], 1500e-6), seed);

    private static void Check(Recipe recipe, List<PartCandidate> parts, int seed)
    {
        var exact = new SetAssembler().Assemble(recipe, parts);
        Assert.Equal(AssemblyMethod.Exact, exact.Method);
        var usable = new CandidatePool(recipe, parts, Defaults, withPairs: false).Usable;
        var judge = Judge(recipe);
        var pricing = RatioPairPricing.TryCreate(recipe, usable, Defaults, () => false);
        if (pricing is null)
        {
            // Only when some position has no part at all (then no set exists).
            Assert.Empty(exact.Sets);
            Assert.Contains(recipe.Positions, p => !usable.Any(u => CandidatePool.Wanted(p, u.Nominal, Defaults)));
            return;
        }

        // The family holds every feasible set: every block of parts that the brute force's own arrangement search
        // (every position order) finds feasible is a member.
        var feasible = 0;
        for (var mask = 1; mask < 1 << usable.Count; mask++)
        {
            if (int.PopCount(mask) == 4 && BruteForce.BlockScore(recipe, usable, mask, judge) is not null)
            {
                feasible++;
                var members = Enumerable.Range(0, usable.Count).Where(i => (mask >> i & 1) == 1).ToArray();
                Assert.True(pricing.Covers(members), $"seed {seed}: feasible set {mask} not in the family");
            }
        }

        var ratio = ColumnBoundStep.Run(recipe, usable, Defaults, [], () => false, enumerateParts: 0);
        var enumerated = ColumnBoundStep.Run(recipe, usable, Defaults, [], () => false, enumerateParts: 64);
        if (feasible == 0)
        {
            Assert.Empty(exact.Sets);
            return;
        }

        Assert.NotNull(ratio);
        Assert.NotNull(enumerated);
        Assert.Contains("two position ratios", ratio.Family, StringComparison.Ordinal);
        Assert.True(ratio.Bound >= exact.Sets.Count, $"seed {seed}: bound {ratio.Bound} < {exact.Sets.Count}");
        ColumnBoundTests.AssertDualFeasible(recipe, usable, judge, ratio, seed);
        // Never below the enumerated LP beyond rounding, and equal to it when both reached the LP optimum.
        Assert.True(ratio.Value >= enumerated.Value - 1e-6, $"seed {seed}: {ratio.Value} < {enumerated.Value}");
        if (ratio.Converged && enumerated.Converged)
        {
            Assert.Equal(enumerated.Value, ratio.Value, 6);
        }
    }

    // Bimodal-like stock (invented for the test): |deviation| within ±25 % of the mode, sign at random, so parts from
    // opposite modes rarely make a ratio within the gain spec.
    private static List<PartCandidate> Bimodal(Random rng, int count, double[] nominals, double mode) =>
        [
            .. Enumerable
                .Range(0, count)
                .Select(i =>
                {
                    var n = nominals[rng.Next(nominals.Length)];
                    var dev = (rng.Next(2) == 0 ? -1 : 1) * mode * (1 + (0.25 * ((2 * rng.NextDouble()) - 1)));
                    var v = n * (1 + dev);
                    var u = v * rng.NextDouble() * 20e-6;
                    return new PartCandidate(i + 1, n, new MeasuredValue(v, u, u / 2), $"T1-B{i + 1:00}");
                }),
        ];

    // The real worst-case rule through the public evaluator (|error| + Σ |∂error/∂R| U per output), arranged by the
    // brute force.
    private static BruteForce.Judge Judge(Recipe recipe) =>
        fills =>
        {
            var values = recipe.Positions.Select((p, k) => (p.Name, fills[k].Value)).ToDictionary();
            var u = recipe.Positions.Select((p, k) => (p.Name, fills[k].U)).ToDictionary();
            var checks = NetworkEvaluator.Evaluate(recipe, values, u);
            return checks.All(c => c.Meets) ? checks.Max(c => c.Score) : null;
        };
}
