namespace SortRig.Planning.Tests.Cups;

/// <summary>Seeded reels of measured deviations (invented test data) for the adaptive cup planner's property
/// tests.</summary>
internal static class CupTestReels
{
    /// <summary>A reel: shape 0 normal, 1 centre binned out, 2 uniform, 3 off-centre; uncertainty up to uMax.</summary>
    internal static List<(double Ppm, double U)> Reel(int seed, int shape, int n, double uMax)
    {
        var rng = new Random(seed);
        double Gauss() => Math.Sqrt(-2 * Math.Log(1 - rng.NextDouble())) * Math.Cos(2 * Math.PI * rng.NextDouble());
        var result = new List<(double, double)>();
        while (result.Count < n)
        {
            var x = shape switch
            {
                0 => 3333 * Gauss(),
                1 => 5000 * Gauss(),
                2 => 20_000 * (rng.NextDouble() - 0.5),
                _ => -4000 + (2500 * Gauss()),
            };
            if (Math.Abs(x) <= 10_000 && (shape != 1 || Math.Abs(x) >= 4000))
            {
                result.Add((x, uMax * rng.NextDouble()));
            }
        }

        return result;
    }
}
