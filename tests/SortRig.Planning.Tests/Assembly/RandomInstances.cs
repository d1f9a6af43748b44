using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Assembly;

/// <summary>Seeded random recipes and parts for the referee tests.</summary>
internal static class RandomInstances
{
    public static readonly string[] MatchedShapes =
    [
        "  - { name: A, nominal: 10k }\n  - { name: B, nominal: 10k }\n",
        "  - { name: A, nominal: 10k }\n  - { name: B, nominal: 10k }\n  - { name: C, nominal: 10k }\n",
        "  - { name: A, nominal: 10k }\n  - { name: B, nominal: 20k }\n",
        "  - { name: A, nominal: 10k, pairs: [parallel] }\n  - { name: B, nominal: 10k, pairs: [parallel] }\n",
        "  - { name: A, nominal: 10k }\n  - { name: B, nominal: 20k, pairs: [series] }\n",
        "  - { name: A, nominal: 10k, pairs: [parallel] }\n  - { name: B, nominal: 20k, pairs: [series] }\n  - { "
            + "name: C, nominal: 10k }\n",
    ];

    public static Recipe Matched(int shape, double ppm = 1000) =>
        RecipeLoader.Load(
            $"recipe: r{shape}\nform: matched\nmatch-ppm: {ppm}\npositions:\n{MatchedShapes[shape]}",
            $"shape{shape}.yaml"
        );

    public static Recipe Divider(bool seriesTop, double tolPpm) =>
        RecipeLoader.Load(
            "recipe: div\nform: network\nground: gnd\nsources:\n  - { name: V1, plus: in, minus: gnd, volts: 10 "
                + "}\npositions:\n"
                + $"  - {{ name: R1, nominal: 10k, between: [in, out]{(seriesTop ? ", pairs: [series]" : "")} }}\n"
                + "  - { name: R2, nominal: 10k, between: [out, gnd] }\n"
                + $"outputs:\n  - {{ name: ratio, kind: voltage-ratio, numerator: out, denominator: in, "
                + $"tolerance-ppm: {tolPpm} }}\n",
            "div.yaml"
        );

    /// <summary>Parts of the given nominals: value = nominal (1 + offset + σ N(0,1)), expanded transfer U = value ×
    /// u.</summary>
    public static List<PartCandidate> Parts(
        Random rng,
        int count,
        double[] nominals,
        double sigma,
        double maxRelU,
        bool equalU = false
    )
    {
        var u0 = rng.NextDouble() * maxRelU;
        return Enumerable
            .Range(0, count)
            .Select(i =>
            {
                var n = nominals[rng.Next(nominals.Length)];
                var v = n * (1 + (sigma * Gauss(rng)));
                var u = v * (equalU ? u0 : rng.NextDouble() * maxRelU);
                return new PartCandidate(i + 1, n, new MeasuredValue(v, u, u / 2), $"T1-A{i + 1:00}");
            })
            .ToList();
    }

    private static double Gauss(Random rng) =>
        Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
}
