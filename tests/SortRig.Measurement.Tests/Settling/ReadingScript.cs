using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

/// <summary>
/// Builds reading sequences with honest timestamps: a fixed start, times that only move forward at the
/// meter's reading interval, values in ohms on the 10 kOhm range of the invented meter.
/// </summary>
internal static class ReadingScript
{
    public const double Range = 10_000;
    public static readonly DateTimeOffset Start = new(2025, 3, 1, 9, 0, 0, TimeSpan.Zero);

    public static Reading At(double seconds, double value) =>
        Reading.Finite(value, Start + TimeSpan.FromSeconds(seconds), Range);

    public static Reading OverloadAt(double seconds) => Reading.Overload(Start + TimeSpan.FromSeconds(seconds), Range);

    /// <summary>count readings every interval seconds from t0; value(t) gets the time since t0 in seconds.</summary>
    public static IEnumerable<Reading> Sampled(double t0, double interval, int count, Func<double, double> value)
    {
        for (var i = 0; i < count; i++)
        {
            var t = i * interval;
            yield return At(t0 + t, value(t));
        }
    }

    /// <summary>Gaussian noise from a seeded generator (Box-Muller), for reproducible sequences.</summary>
    public static Func<double> Gaussian(int seed, double sigma)
    {
        var random = new Random(seed);
        return () =>
            sigma * Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
    }

    public static SettleTracker Tracker(SettleOptions? options = null) =>
        new(InventedMeter.R10k, InventedMeter.One, options);

    public static List<SettleVerdict> Feed(this SettleTracker tracker, IEnumerable<Reading> readings) =>
        readings.Select(tracker.Add).ToList();
}
