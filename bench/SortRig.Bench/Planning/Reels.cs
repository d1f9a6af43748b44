using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;

namespace SortRig.Bench.Planning;

/// <summary>Simulated reels (our own invented data): deviations in ppm, seeded.</summary>
internal static class Reels
{
    public const double StockPpm = 10_000;

    /// <summary>Normal with σ = tolerance / 3, truncated to the tolerance.</summary>
    public static List<double> Normal(int seed, int n) => Draw(seed, n, StockPpm / 3, gap: 0);

    /// <summary>Normal with σ = tolerance / 2, with |x| &lt; 0.4 tolerance missing (centre binned out),
    /// truncated.</summary>
    public static List<double> Bimodal(int seed, int n) => Draw(seed, n, StockPpm / 2, gap: 0.4 * StockPpm);

    /// <summary>Uniform over the tolerance.</summary>
    public static List<double> Uniform(int seed, int n)
    {
        var rng = new Random(seed);
        return [.. Enumerable.Range(0, n).Select(_ => StockPpm * ((2 * rng.NextDouble()) - 1))];
    }

    /// <summary>Normal with σ = tolerance / 4 centred at −0.4 tolerance (a reel from one side of a lot),
    /// truncated.</summary>
    public static List<double> Offset(int seed, int n)
    {
        var rng = new Random(seed);
        var result = new List<double>(n);
        while (result.Count < n)
        {
            var x = (-0.4 * StockPpm) + (StockPpm / 4 * Gauss(rng));
            if (Math.Abs(x) <= StockPpm)
            {
                result.Add(x);
            }
        }

        return result;
    }

    public static PartCandidate Part(long id, double nominal, double ppm, double uPpm) =>
        new(
            id,
            nominal,
            new MeasuredValue(nominal * (1 + (ppm * 1e-6)), nominal * uPpm * 1e-6, nominal * uPpm * 0.5e-6),
            $"P{id}"
        );

    public static double Gauss(Random rng) =>
        Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());

    private static List<double> Draw(int seed, int n, double sigma, double gap)
    {
        var rng = new Random(seed);
        var result = new List<double>(n);
        while (result.Count < n)
        {
            var x = sigma * Gauss(rng);
            if (Math.Abs(x) >= gap && Math.Abs(x) <= StockPpm)
            {
                result.Add(x);
            }
        }

        return result;
    }
}
