using SortRig.Planning.Assembly;
using SortRig.Planning.Ordering;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Ordering;

public sealed class OrderEstimatorTests
{
    // A pair recipe: two positions of one nominal whose ratio must agree within the match.
    private static Recipe Pair(double ppm) =>
        RecipeLoader.Load(
            $"recipe: pair\nform: matched\nmatch-ppm: {ppm}\npositions:\n  - {{ name: A, nominal: 10k }}\n  - {{ "
                + $"name: B, nominal: 10k }}\n",
            "pair.yaml"
        );

    /// <summary>
    /// Uniform spacings (textbook result, e.g. David &amp; Nagaraja, Order Statistics, sec. 6.4; from memory): for n
    /// points drawn uniformly on an interval of length L, P(every gap between neighbours exceeds w) = (1 − (n − 1) w /
    /// L)^n when (n − 1) w ≤ L. A pair recipe makes at least one set from n parts exactly when some gap is ≤ w, so
    /// P(at least one set from n parts) = 1 − (1 − (n − 1) w / L)^n; for n = 2 this is the geometric probability
    /// 2 (w / L) − (w / L)^2 that two uniform points lie within w of each other.
    /// </summary>
    private static double AtLeastOneSet(int n, double wOverL) => 1 - Math.Pow(1 - ((n - 1) * wOverL), n);

    [Fact]
    public void TwoParts_FromUniformStock_MatchWithTheGeometricProbability()
    {
        // Exact ratio form, derived by hand: values a, b uniform on [A, B] = [1 − t, 1 + t] (L = 2t), match m. The pair
        // fails when the larger exceeds (1 + m) times the smaller. For a > b the failing area is ∫_A^{b0} (B − (1 + m)
        // b) db = (1 + m)(b0 − A)² / 2 with b0 = B / (1 + m); both orders double it, so
        // P(pair) = 1 − (1 + m)(b0 − A)² / L². To first order in m (w = m): 1 − (1 − w/L)² = 2 (w/L) − (w/L)², the
        // textbook geometric probability (e.g. Feller, vol. I, or any probability text's "two points on a segment";
        // from memory).
        const double t = 0.01,
            m = 0.002;
        double a = 1 - t,
            b = 1 + t,
            l = 2 * t,
            b0 = b / (1 + m);
        var exact = 1 - ((1 + m) * (b0 - a) * (b0 - a) / (l * l));
        Assert.Equal(2 * (m / l) - ((m / l) * (m / l)), exact, 2); // first-order agreement of the two forms

        const int trials = 4000;
        var estimate = new OrderEstimator().Estimate(
            Pair(m * 1e6),
            new OrderOptions(
                1,
                StockDistribution.Uniform(t),
                transferUncertainty: 0,
                trials: trials,
                seed: 7,
                curvePoints: 2
            )
        );
        var atOne = Assert.Single(estimate.Curve, c => c.SetEquivalents == 1);

        // Monte Carlo inside its own 4-sigma binomial interval around the closed form.
        var sigma = Math.Sqrt(exact * (1 - exact) / trials);
        Assert.InRange(atOne.MeanSets, exact - (4 * sigma), exact + (4 * sigma));
    }

    [Fact]
    public void ExpectedSets_FromFourDraws_MatchTheSpacingsClosedForm()
    {
        // Four parts x1 < x2 < x3 < x4 (gaps g1, g2, g3) make two pairs exactly when g1 ≤ w and g3 ≤ w (any other
        // pairing within w implies both), and at least one when some gap ≤ w. With uniform spacings' joint survival
        // P(g_i > a_i for i in S) = (1 − Σ a_i / L)^n (same source as above, from memory), inclusion–exclusion gives
        // E[sets] = [1 − (1 − 3w/L)^4] + [1 − 2(1 − w/L)^4 + (1 − 2w/L)^4].
        // A narrow stock (±0.1 %) makes the ratio window w = m·value equal to m·nominal within 0.1 % of itself.
        const double t = 0.001,
            m = 200e-6,
            q = m / (2 * t);
        var expected = AtLeastOneSet(4, q) + 1 - (2 * Math.Pow(1 - q, 4)) + Math.Pow(1 - (2 * q), 4);

        const int trials = 3000;
        var recipe = Pair(m * 1e6);
        var assembler = new SetAssembler(OrderOptions.FastAssembly);
        var classes = new[] { (10e3, 2) };
        var made = Enumerable
            .Range(0, trials)
            .Select(i =>
                (double)
                    assembler
                        .Assemble(recipe, new TrialReel(classes, StockDistribution.Uniform(t), 0, 11, i).Order(2))
                        .Sets.Count
            )
            .ToArray();
        var mean = made.Average();
        var sd = Math.Sqrt(made.Select(x => (x - mean) * (x - mean)).Sum() / (trials - 1));
        Assert.InRange(mean, expected - (4 * sd / Math.Sqrt(trials)), expected + (4 * sd / Math.Sqrt(trials)));
    }

    [Fact]
    public void OrderAtEachConfidence_IsTheSmallestOrderTheClosedFormAllows()
    {
        // One pair wanted; an order of k sets' worth is 2k parts, which make the pair with probability
        // F(k) = 1 − (1 − (2k − 1) w/L)^(2k) (uniform spacings, above). With w/L = 0.05: F = 0.0975, 0.478, 0.822,
        // 0.968, 0.9975 for k = 1..5, so 90 % and 95 % need k = 4 and 99 % needs k = 5, each with a margin of several
        // binomial standard errors at 2 000 trials.
        const double t = 0.001,
            m = 100e-6;
        var estimate = new OrderEstimator().Estimate(
            Pair(m * 1e6),
            new OrderOptions(1, StockDistribution.Uniform(t), transferUncertainty: 0, trials: 2000, seed: 3)
        );
        Assert.Equal([4, 4, 5], estimate.Levels.Select(l => l.SetEquivalents ?? -1));
        Assert.All(estimate.Levels, l => Assert.Equal(2 * l.SetEquivalents!.Value, Assert.Single(l.Lines).Quantity));
        foreach (var level in estimate.Levels)
        {
            var f = AtLeastOneSet(2 * level.SetEquivalents!.Value, m / (2 * t));
            var sigma = Math.Sqrt(f * (1 - f) / 2000);
            Assert.InRange(level.Reached, f - (4 * sigma), Math.Min(1, f + (4 * sigma)));
            Assert.True(level.Reached >= level.Confidence, $"reached {level.Reached} at {level.Confidence}");
        }

        // Leftovers: one pair is used, so the rest of the order is left over (no pair builds in this recipe).
        Assert.All(estimate.Levels, l =>
            Assert.InRange(
                Assert.Single(l.Lines).ExpectedLeftover,
                l.Lines[0].Quantity - 2,
                l.Lines[0].Quantity - 2 + (2 * (1 - l.Reached)) + 1e-9
            )
        );
    }

    [Fact]
    public void SameSeed_GivesTheSameEstimate_WhateverTheThreadCount()
    {
        var recipe = RecipeLoader.Load(File.ReadAllText(RepoPaths.Recipe("matched-quad.yaml")), "matched-quad.yaml");
        OrderEstimate Run(int seed, int threads) =>
            new OrderEstimator().Estimate(
                recipe,
                new OrderOptions(3, StockDistribution.Normal(0.01), trials: 60, seed: seed, maxParallelism: threads)
            );
        var a = Run(5, 1);
        var b = Run(5, 2);
        Assert.Equal(
            a.Levels.Select(l => (l.SetEquivalents, l.Reached)),
            b.Levels.Select(l => (l.SetEquivalents, l.Reached))
        );
        Assert.Equal(a.Curve, b.Curve);
        Assert.Equal(a.MeanSetEquivalents, b.MeanSetEquivalents);
        Assert.NotEqual(a.Curve.Select(c => c.MeanSets), Run(6, 2).Curve.Select(c => c.MeanSets));
    }

    [Fact]
    public void PerNominalTrim_KeepsEachLevelsShare_AndNeverBuysMore()
    {
        // A 10k : 20k : 20k matched set. The trim may only lower a nominal's quantity while the same trials still make
        // the sets in at least the level's share, so every trimmed level must keep its confidence, stay at or below the
        // joint order and at or above N sets' own parts (the definition, checked on the result).
        var recipe = RecipeLoader.Load(
            "recipe: t\nform: matched\nmatch-ppm: 1500\npositions:\n  - { name: A, nominal: 10k }\n  - { name: B, "
                + "nominal: 20k }\n  - { name: C, nominal: 20k }\n",
            "t.yaml"
        );
        var joint = new OrderEstimator().Estimate(
            recipe,
            new OrderOptions(4, StockDistribution.Normal(0.01), trials: 300, seed: 2)
        );
        var trimmed = new OrderEstimator().Estimate(
            recipe,
            new OrderOptions(4, StockDistribution.Normal(0.01), trials: 300, seed: 2, perNominal: true)
        );
        foreach (var (j, t) in joint.Levels.Zip(trimmed.Levels))
        {
            Assert.True(t.Trimmed);
            Assert.True(t.Reached >= t.Confidence, $"trimmed order reached {t.Reached} at {t.Confidence}");
            Assert.All(t.Lines.Zip(j.Lines), p =>
                Assert.InRange(p.First.Quantity, 4 * p.First.PerSet, p.Second.Quantity)
            );
        }

        Assert.True(
            trimmed.Levels.Sum(l => l.TotalParts) < joint.Levels.Sum(l => l.TotalParts),
            "the trim should save parts on this recipe"
        );
    }

    [Fact]
    public void ZeroSets_IsRefused()
    {
        var e = Assert.Throws<OrderRefusedException>(() => new OrderOptions(0, StockDistribution.Normal(0.01)));
        Assert.StartsWith("sets:", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void MatchTighterThanTheMeter_IsRefusedBeforeAnyTrial()
    {
        // Two parts exactly at nominal, each ±20 ppm: worst case (1 + U)/(1 − U) − 1 = 40 ppm > a 30 ppm match
        // (the matched rule of docs/planning.md with both parts at the edges of their uncertainty).
        var e = Assert.Throws<OrderRefusedException>(() =>
            new OrderEstimator().Estimate(
                Pair(30),
                new OrderOptions(1, StockDistribution.Normal(0.01), transferUncertainty: 20e-6)
            )
        );
        Assert.Contains("tighter than the meter", e.Message, StringComparison.Ordinal);
        Assert.Contains("40", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void RecipeTheStockCannotMeet_IsRefusedWithTheReason()
    {
        // A divider whose target 0.6 lies far outside what ±1 % parts of 10k:10k (ratio 0.5) can reach.
        var recipe = RecipeLoader.Load(
            "recipe: off\nform: network\nground: gnd\nsources:\n  - { name: V1, plus: in, minus: gnd, volts: 10 "
                + "}\npositions:\n"
                + "  - { name: R1, nominal: 10k, between: [in, out] }\n  - { name: R2, nominal: 10k, between: [out, "
                + "gnd] }\n"
                + "outputs:\n  - { name: ratio, kind: voltage-ratio, numerator: out, denominator: in, target: 0.6, "
                + "tolerance-ppm: 100 }\n",
            "off.yaml"
        );
        var e = Assert.Throws<OrderRefusedException>(() =>
            new OrderEstimator().Estimate(recipe, new OrderOptions(2, StockDistribution.Normal(0.01), maxParts: 2000))
        );
        Assert.Contains("not one set", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void PartCapTooSmallForTheSets_IsRefused()
    {
        var e = Assert.Throws<OrderRefusedException>(() =>
            new OrderEstimator().Estimate(
                Pair(1000),
                new OrderOptions(10, StockDistribution.Normal(0.01), maxParts: 15)
            )
        );
        Assert.StartsWith("max-parts:", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void PriceBreaks_FindACheaperLargerOrder()
    {
        // Arithmetic of quantity breaks (common practice, no source): 90 parts at 0.10 = 9.00; 100 at 0.05 = 5.00.
        var prices = new PriceBreaks([new PriceBreak(1, 0.10), new PriceBreak(100, 0.05)]);
        Assert.Equal(9.0, prices.Cost(90), 9);
        Assert.Equal((100, 5.0), prices.CheapestAtLeast(90));
        Assert.Equal((120, 6.0), prices.CheapestAtLeast(120));
    }
}
