using FsCheck;
using FsCheck.Fluent;
using SortRig.Measurement.Readings;
using static SortRig.Measurement.Tests.Settling.ReadingScript;

namespace SortRig.Measurement.Tests.Settling;

/// <summary>A random script of finite and overload readings (insertions, flickers, removals) on a 10 kOhm
/// part.</summary>
public sealed record ScriptCase(int WindowLength, int MinReadings, (int StepMs, bool Overload, int Ppm)[] Steps)
{
    public IEnumerable<Reading> Readings()
    {
        var t = 0.0;
        foreach (var (stepMs, overload, ppm) in Steps)
        {
            t += stepMs / 1000.0;
            yield return overload ? OverloadAt(t) : At(t, 10_000 * (1 + (ppm * 1e-6)));
        }
    }

    public override string ToString() => $"N={WindowLength} min={MinReadings} steps={Steps.Length}";
}

/// <summary>value(t) = R (1 + d e^(−t/τ)) + noise, from the insertion at t = 0; times jitter ±5 % around the
/// interval.</summary>
public sealed record ExponentialCase(double Interval, double Tau, double Excess, double NoiseOhms, int Seed)
{
    public const double R = 10_000;

    public double ExcessOhms(double t) => R * Excess * Math.Exp(-t / Tau);

    public IEnumerable<Reading> Readings(double duration)
    {
        var random = new Random(Seed);
        var noise = Gaussian(Seed + 1, NoiseOhms);
        for (var t = 0.0; t <= duration; t += Interval * (0.95 + (0.1 * random.NextDouble())))
        {
            yield return At(t, R + ExcessOhms(t) + noise());
        }
    }
}

/// <summary>value(t) = R + b t + noise with |b| × window duration a multiple of the target.</summary>
public sealed record LinearCase(double Interval, double SlopeOhmsPerSecond, double NoiseOhms, int Seed)
{
    public IEnumerable<Reading> Readings(double duration)
    {
        var random = new Random(Seed);
        var noise = Gaussian(Seed + 1, NoiseOhms);
        for (var t = 0.0; t <= duration; t += Interval * (0.95 + (0.1 * random.NextDouble())))
        {
            yield return At(t, 10_000 + (SlopeOhmsPerSecond * t) + noise());
        }
    }
}

/// <summary>FsCheck generators for the settle properties. Target 10 ppm of 10 kOhm = 0.1 Ohm, window 8.</summary>
public static class SettleArbitraries
{
    public const double TargetOhms = 0.1;

    public static Arbitrary<ScriptCase> Scripts() =>
        Arb.From(
            from window in Gen.Choose(3, 10)
            from min in Gen.Choose(1, 25)
            from length in Gen.Choose(20, 400)
            from steps in Gen.ArrayOf(
                from stepMs in Gen.Choose(1, 120)
                from overload in Gen.Frequency((6, Gen.Constant(false)), (1, Gen.Constant(true)))
                from ppm in Gen.Choose(-3, 3)
                select (stepMs, overload, ppm),
                length
            )
            select new ScriptCase(window, min, steps)
        );

    public static Arbitrary<ExponentialCase> Exponentials() =>
        Arb.From(
            from intervalMs in Gen.Choose(10, 200)
            from tauPercentOfWindow in Gen.Choose(5, 200)
            from excessLog in Gen.Choose(-500, -130)
            from sign in Gen.Elements(-1.0, 1.0)
            from noisePercentOfTarget in Gen.Choose(2, 25)
            from seed in Gen.Choose(0, int.MaxValue - 1)
            let interval = intervalMs / 1000.0
            select new ExponentialCase(
                interval,
                Math.Max(0.005, 7 * interval * tauPercentOfWindow / 100.0),
                sign * Math.Pow(10, excessLog / 100.0),
                TargetOhms * noisePercentOfTarget / 100.0,
                seed
            )
        );

    public static Arbitrary<LinearCase> Lines() =>
        Arb.From(
            from intervalMs in Gen.Choose(10, 200)
            from excursionTenths in Gen.Choose(10, 100)
            from sign in Gen.Elements(-1.0, 1.0)
            from noisePercentOfTarget in Gen.Choose(0, 5)
            from seed in Gen.Choose(0, int.MaxValue - 1)
            let window = 7 * intervalMs / 1000.0
            select new LinearCase(
                intervalMs / 1000.0,
                sign * TargetOhms * excursionTenths / 10.0 / window,
                TargetOhms * noisePercentOfTarget / 100.0,
                seed
            )
        );
}
