using SortRig.Planning.Assembly;
using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>
/// The ratio-pair start and bound for the difference amplifiers (<see cref="RatioPairStart"/>). Referees: a grid over
/// both ratios through the public network evaluator (no feasible point lies beyond the computed reach of a), and the
/// exact search on small instances (the bound is never below its optimum; every set meets every spec in the worst case
/// through the evaluator, no part twice).
/// </summary>
public sealed class RatioPairStartTests
{
    private static readonly AssemblyOptions Defaults = new();

    private static readonly Recipe s_g10 = RecipeLoader.Load(
        File.ReadAllText(RepoPaths.Recipe("diff-amp-g10.yaml")),
        "diff-amp-g10.yaml"
    );

    [Fact]
    public void Reach_HoldsEveryFeasiblePointOfAGrid()
    {
        // R1 = R3 = 1k; R2 = 10k·e^ta, R4 = 10k·e^tb, no uncertainty; grid step 20 ppm over ±0.3 %.
        double[] nominal = [1e3, 10e3, 1e3, 10e3];
        var ranges = RatioPairStart.Ranges(new NetworkRule(s_g10), nominal, (0, 1, 2, 3));
        Assert.NotNull(ranges);
        var (centre, shift, a, b) = ranges.Value;
        double loA = double.PositiveInfinity,
            hiA = double.NegativeInfinity,
            loB = double.PositiveInfinity,
            hiB = double.NegativeInfinity;
        for (var ia = -60; ia <= 60; ia++)
        {
            for (var ib = -120; ib <= 120; ib++)
            {
                var (ta, tb) = (ia * 20e-6, ib * 20e-6);
                var values = new Dictionary<string, double>
                {
                    ["R1"] = 1e3,
                    ["R2"] = 10e3 * Math.Exp(ta),
                    ["R3"] = 1e3,
                    ["R4"] = 10e3 * Math.Exp(tb),
                };
                var zero = values.ToDictionary(v => v.Key, _ => 0.0);
                if (NetworkEvaluator.Evaluate(s_g10, values, zero).All(c => c.Meets))
                {
                    (loA, hiA) = (Math.Min(loA, ta), Math.Max(hiA, ta));
                    (loB, hiB) = (Math.Min(loB, tb), Math.Max(hiB, tb));
                }
            }
        }

        // No feasible grid point beyond either reach; and each reach within two grid steps and its 1 % widening of the
        // grid's extremes (not vacuous). The gain rests mostly on a (R2/R1), so b reaches further (textbook
        // difference amplifier).
        static double Slack(double reach) => 40e-6 + (0.011 * reach);
        Assert.InRange(centre + a.Up - hiA, 0, Slack(a.Up));
        Assert.InRange(loA - (centre - a.Down), 0, Slack(a.Down));
        Assert.InRange(centre + b.Up - hiB, 0, Slack(b.Up));
        Assert.InRange(loB - (centre - b.Down), 0, Slack(b.Down));
        Assert.True(b.Up > a.Up && a.Up > shift && a.Down > shift);
    }

    public static TheoryData<int> Seeds => new(Enumerable.Range(0, 24));

    [Theory]
    [MemberData(nameof(Seeds))]
    public void Bound_NeverBelowTheExactOptimum_SetsMeetEverySpec(int seed)
    {
        // Half the seeds narrow (σ 400 ppm), half wide (σ 1 000 ppm), where pairs fail to find partners.
        var rng = new Random(58_000 + seed);
        var parts = RandomInstances.Parts(rng, 16, [1e3, 10e3], sigma: seed % 2 == 0 ? 400e-6 : 1000e-6, 20e-6);
        var exact = new SetAssembler().Assemble(s_g10, parts);
        Assert.Equal(AssemblyMethod.Exact, exact.Method);
        var usable = new CandidatePool(s_g10, parts, Defaults, withPairs: false).Usable;
        var (sets, bound) = RatioPairStart.Run(s_g10, usable, new NetworkRule(s_g10), Defaults);
        Assert.NotNull(bound);
        Assert.True(bound >= exact.Sets.Count, $"seed {seed}: bound {bound} < optimum {exact.Sets.Count}");
        Assert.True(sets.Count <= exact.Sets.Count);
        var used = new HashSet<int>();
        foreach (var (fills, _) in sets)
        {
            Assert.All(fills, f => Assert.True(used.Add(f.A), "part used twice"));
            var values = s_g10.Positions.Select((p, k) => (p.Name, fills[k].Value)).ToDictionary();
            var u = s_g10.Positions.Select((p, k) => (p.Name, fills[k].Uncertainty)).ToDictionary();
            Assert.All(NetworkEvaluator.Evaluate(s_g10, values, u), c => Assert.True(c.Meets, c.Name));
        }
    }

    [Fact]
    public void Assembler_OnABimodalReel_SetsMeetEverySpec_AtLeastTheSweep()
    {
        // 200 parts, half 1k and half 10k, deviations ±(0.4-1.0) % in two modes (our own invented reel).
        var rng = new Random(61_000);
        var parts = Enumerable
            .Range(1, 200)
            .Select(id =>
            {
                var nominal = id % 2 == 0 ? 1e3 : 10e3;
                var d = (rng.Next(2) == 0 ? -1 : 1) * (4e-3 + (6e-3 * rng.NextDouble()));
                return Part(id, nominal, d);
            })
            .ToList();
        var options = new AssemblyOptions(timeLimit: TimeSpan.FromSeconds(5));
        var result = new SetAssembler(options).Assemble(s_g10, parts);
        var pool = new CandidatePool(s_g10, parts, options, withPairs: false);
        var sweep = new SweepPlanner(s_g10, pool, new NetworkRule(s_g10), options).Run();
        Assert.True(result.Sets.Count >= sweep.Count, $"{result.Sets.Count} < sweep {sweep.Count}");
        Assert.True(result.Sets.Count <= result.UpperBound);
        var used = new HashSet<long>();
        foreach (var set in result.Sets)
        {
            Assert.All(set.Fills, f => Assert.True(used.Add(f.Parts[0].Id), "part used twice"));
            var values = set.Fills.ToDictionary(f => f.Position, f => f.Value);
            var u = set.Fills.ToDictionary(f => f.Position, f => f.ExpandedUncertainty);
            Assert.All(NetworkEvaluator.Evaluate(s_g10, values, u), c => Assert.True(c.Meets, c.Name));
        }
    }

    [Fact]
    public void Bound_IsTighterThanThePartCount_WhereRatiosFindNoPartner()
    {
        // 4 parts of each nominal; the 10k parts sit 0.5 % above the 1k parts' deviations for two of them: those two
        // ratio pairs are beyond any partner's reach, so at most 1 set (the part count says 2).
        double[] d1 = [0, 10e-6, 0, 5e-6];
        double[] d10 = [0, 5e-6, 5e-3, 5.01e-3];
        var parts = d1.Select((d, n) => Part(n + 1, 1e3, d))
            .Concat(d10.Select((d, n) => Part(n + 11, 10e3, d)))
            .ToList();
        var (sets, bound) = RatioPairStart.Run(s_g10, parts, new NetworkRule(s_g10), Defaults);
        Assert.Equal(1, bound);
        Assert.Single(sets);
        Assert.Single(new SetAssembler().Assemble(s_g10, parts).Sets);
    }

    private static PartCandidate Part(long id, double nominal, double deviation)
    {
        var v = nominal * (1 + deviation);
        return new PartCandidate(
            id,
            nominal,
            new SortRig.Measurement.Uncertainty.MeasuredValue(v, v * 5e-6, v * 2.5e-6),
            $"P{id}"
        );
    }
}
