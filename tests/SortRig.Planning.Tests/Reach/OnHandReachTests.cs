using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Ordering;
using SortRig.Planning.Reach;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Reach;

public sealed class OnHandReachTests
{
    private static Recipe Pair(double ppm) =>
        RecipeLoader.Load(
            $"recipe: pair\nform: matched\nmatch-ppm: {ppm}\npositions:\n  - {{ name: A, nominal: 10k }}\n  - {{ "
                + $"name: B, nominal: 10k }}\n",
            "pair.yaml"
        );

    private static PartCandidate Part(long id, double ppm) =>
        new(id, 10e3, new MeasuredValue(10e3 * (1 + (ppm * 1e-6)), 0, 0), null);

    [Fact]
    public void OnePair_TightestMatch_IsTheClosestNeighboursRatio()
    {
        // Hand-derived: with no uncertainty, one pair can be made at match m exactly when two sorted neighbours have
        // ratio − 1 ≤ m, so the tightest match is min over neighbours of (x[i+1] / x[i] − 1).
        double[] ppm = [-4000, -1500, 700, 1900, 6000];
        var parts = ppm.Select((p, i) => Part(i, p)).ToList();
        var values = ppm.Select(p => 1 + (p * 1e-6)).ToArray();
        var closest = values.Zip(values.Skip(1), (a, b) => ((b / a) - 1) * 1e6).Min();

        var reach = new OnHandReach().Find(Pair(1000), parts, 1, precision: 0.001);
        Assert.InRange(closest, reach.TighterScale * 1000, reach.MatchPpm!.Value);
        Assert.True(reach.Scale / reach.TighterScale - 1 <= 0.001);
    }

    [Fact]
    public void TwoPairs_TightestMatch_IsTheWorseOfTheOuterNeighbourPairs()
    {
        // Hand-derived: four sorted parts make two pairs within m exactly when x2/x1 − 1 ≤ m and x4/x3 − 1 ≤ m (any
        // other pairing within m implies both), so the tightest match is the larger of those two ratios.
        double[] ppm = [-3000, -2100, 500, 2000];
        var values = ppm.Select(p => 1 + (p * 1e-6)).ToArray();
        var expected = Math.Max((values[1] / values[0]) - 1, (values[3] / values[2]) - 1) * 1e6;
        var reach = new OnHandReach().Find(Pair(5000), ppm.Select((p, i) => Part(i, p)).ToList(), 2, precision: 0.001);
        Assert.InRange(expected, reach.TighterScale * 5000, reach.MatchPpm!.Value);
    }

    [Fact]
    public void Reach_AgreesWithTheAssembler_AtTheReportedMatchAndJustTighter()
    {
        // A seeded ±1 % normal reel of 200 parts for the matched quad; the assembler run at the reported match makes
        // the sets wanted, and at the tighter end of the final bracket it makes fewer.
        var recipe = RecipeLoader.Load(File.ReadAllText(RepoPaths.Recipe("matched-quad.yaml")), "matched-quad.yaml");
        var rng = new Random(42);
        var parts = Enumerable
            .Range(0, 200)
            .Select(i =>
            {
                var v = 10e3 * (1 + MathNet.Numerics.Distributions.Normal.Sample(rng, 0, 0.01 / 3));
                return new PartCandidate(i, 10e3, new MeasuredValue(v, v * 10e-6, v * 10e-6), null);
            })
            .ToList();
        var reach = new OnHandReach().Find(recipe, parts, 30);
        var assembler = new SetAssembler(OrderOptions.FastAssembly);
        Assert.True(assembler.Assemble(ToleranceScale.Apply(recipe, reach.Scale), parts).Sets.Count >= 30);
        Assert.True(assembler.Assemble(ToleranceScale.Apply(recipe, reach.TighterScale), parts).Sets.Count < 30);
        Assert.True(reach.Scale / reach.TighterScale - 1 <= 0.01);
    }

    [Fact]
    public void NetworkRecipe_ScalesEveryOutputTolerance()
    {
        var recipe = SortRig.Planning.Tests.Assembly.RandomInstances.Divider(false, 400);
        var scaled = ToleranceScale.Apply(recipe, 0.25);
        Assert.Equal(100, Assert.IsType<VoltageRatioSpec>(Assert.Single(scaled.Outputs)).TolerancePpm, 9);
    }

    [Fact]
    public void ExtraPart_BandSitsAroundALeftover_WithinTheMatch()
    {
        // Three isolated parts (5 000 ppm apart) make no pair at 1 000 ppm; one extra part within 1 000 ppm in ratio of
        // any of them makes one (the matched rule). The widest band found must hold a leftover and be about 2 000 ppm
        // wide.
        var parts = new[] { Part(1, 0), Part(2, 5000), Part(3, 10000) };
        var reach = new OnHandReach().Find(Pair(20_000), parts, 1);
        Assert.Equal(1, reach.SetsAsWritten);

        var tight = new OnHandReach().Find(Pair(1000), [.. parts, Part(4, 20_000)], 1);
        Assert.Equal(0, tight.SetsAsWritten);
        var band = Assert.Single(tight.ExtraParts);
        Assert.Contains([0.0, 5000.0, 10000.0, 20_000], p => band.LowPpm <= p && p <= band.HighPpm);
        Assert.InRange(band.HighPpm - band.LowPpm, 1700, 2100);
    }

    [Fact]
    public void TooFewParts_IsRefusedWithTheCount()
    {
        var e = Assert.Throws<OrderRefusedException>(() =>
            new OnHandReach().Find(Pair(1000), [Part(1, 0), Part(2, 10)], 2)
        );
        Assert.Contains("fill at most 2", e.Message, StringComparison.Ordinal);
        Assert.Throws<OrderRefusedException>(() => new OnHandReach().Find(Pair(1000), [Part(1, 0), Part(2, 10)], 0));
    }
}
