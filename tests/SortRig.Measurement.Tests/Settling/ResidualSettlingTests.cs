using MathNet.Numerics;
using MathNet.Numerics.Distributions;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Uncertainty;
using static SortRig.Measurement.Tests.Settling.ReadingScript;

namespace SortRig.Measurement.Tests.Settling;

/// <summary>
/// The residual-settling term and the settling span, on the invented meter at 1 NPLC (1 ppm step = 0.01 Ohm on
/// 10 kOhm). A cooling part's excess is c·e^(−t/τ); its slope is −excess/τ (calculus), so the excess still
/// present is |slope| × τ.
/// </summary>
public sealed class ResidualSettlingTests
{
    private const double Dt = 0.041;
    private const double Step = 0.01;

    [Fact]
    public void Accepted_DefaultOptions_CarryRectangularResidualTermInBothUncertainties()
    {
        var noise = Gaussian(11, 0.004);
        var run = SettleTracker.Run(Sampled(0, Dt, 60, _ => 10_000.0 + noise()), InventedMeter.R10k, InventedMeter.One);
        var a = run.Final.Acceptance!;

        // Independent check with MathNet's least squares and Student t: a = (|b| + t·max(SE(b), (step/√12)/√Sxx)) × 5
        // s.
        var x = a.Readings.Select(r => (r.Time - a.Readings[0].Time).TotalSeconds).ToArray();
        var y = a.Readings.Select(r => r.Value).ToArray();
        var (intercept, slope) = Fit.Line(x, y);
        var sxx = x.Sum(v => Math.Pow(v - x.Average(), 2));
        var ssr = x.Select((v, i) => Math.Pow(y[i] - intercept - (slope * v), 2)).Sum();
        var se = Math.Max(Math.Sqrt(ssr / (x.Length - 2) / sxx), Step / Math.Sqrt(12) / Math.Sqrt(sxx));
        var expected = (Math.Abs(slope) + (StudentT.InvCDF(0, 1, x.Length - 2, 0.975) * se)) * 5.0;
        Assert.Equal(expected, a.ResidualHalfWidth, 9);

        // JCGM 100:2008 4.3.7 (u = a/√3) and 5.1.2 eq. (10) (root sum of squares), added to the window's own budgets.
        var plain = ResistanceUncertainty.For(a.Readings, InventedMeter.R10k, InventedMeter.One, SpecPeriod.Year1);
        var u = expected / Math.Sqrt(3);
        Assert.Equal(
            Math.Sqrt((plain.StandardUncertainty * plain.StandardUncertainty) + (u * u)),
            a.Value.StandardUncertainty,
            9
        );
        Assert.Equal(
            Math.Sqrt((plain.TransferUncertainty * plain.TransferUncertainty) + (u * u)),
            a.Value.TransferUncertainty,
            9
        );
        Assert.Equal(plain.Value, a.Value.Value, 9);
    }

    [Fact]
    public void Accepted_AssumedTimeConstantZero_LeavesTheWindowBudgetAlone()
    {
        var noise = Gaussian(11, 0.004);
        var options = new SettleOptions { AssumedTimeConstant = TimeSpan.Zero };
        var a = SettleTracker
            .Run(Sampled(0, Dt, 60, _ => 10_000.0 + noise()), InventedMeter.R10k, InventedMeter.One, options)
            .Final.Acceptance!;
        var plain = ResistanceUncertainty.For(a.Readings, InventedMeter.R10k, InventedMeter.One, SpecPeriod.Year1);
        Assert.Equal(0, a.ResidualHalfWidth);
        Assert.Equal(plain, a.Value);
    }

    [Fact]
    public void SettlingSpan_SlowExponentialHiddenByQuantisation_WaitsUntilTheExcessIsWithinTarget()
    {
        // A part 17 ppm low, recovering with τ = 4 s: over 0.3 s it moves 1.3 ppm, about one step, so 8 readings can
        // all be equal. The window's slope test then sees no slope (the flaw the benchmark found); the span does.
        const double tau = 4.0,
            target = 0.05; // 5 ppm of 10 kOhm
        var noise = Gaussian(5, 0.003);
        double Excess(double t) => -0.17 * Math.Exp(-t / tau);
        List<Reading> Readings() =>
            [.. Sampled(0.06, Dt, 1000, t => Math.Round((10_000.0 + Excess(t + 0.06) + noise()) / Step) * Step)];
        var before = new SettleOptions
        {
            Target = SettleTarget.Ohms(target),
            AssumedTimeConstant = TimeSpan.Zero,
            MaxSettleTime = TimeSpan.FromSeconds(40),
        };
        var span = before with
        {
            AssumedTimeConstant = TimeSpan.FromSeconds(5),
            SettlingSpan = TimeSpan.FromSeconds(4),
        };

        var old = SettleTracker.Run(Readings(), InventedMeter.R10k, InventedMeter.One, before).Final.Acceptance!;
        var now = SettleTracker.Run(Readings(), InventedMeter.R10k, InventedMeter.One, span).Final.Acceptance!;

        Assert.True(
            Math.Abs(old.Value.Value - 10_000) > target,
            $"the window rule alone accepted {old.Value.Value - 10_000:F3} Ohm off"
        );
        Assert.True(
            Math.Abs(now.Value.Value - 10_000) <= target,
            $"accepted {now.Value.Value - 10_000:F3} Ohm off after {now.TimeToSettle.TotalSeconds:F2} s"
        );
        Assert.InRange(now.ResidualHalfWidth, 1e-6, target);
        Assert.True(Math.Abs(now.Value.Value - 10_000) <= now.Value.ExpandedTransfer, "error within the stated U");
    }

    [Fact]
    public void SettlingSpan_IdenticalReadings_NeedMoreThanOneWindowToProveFlat()
    {
        // 8 equal readings over 0.29 s bound the slope only to the resolution: t·(0.01/√12)/√Sxx × 5 s = 0.13 Ohm >
        // 0.05.
        var options = new SettleOptions { Target = SettleTarget.Ohms(0.05), SettlingSpan = TimeSpan.FromSeconds(4) };
        var run = SettleTracker.Run(Sampled(0, Dt, 200, _ => 10_000.0), InventedMeter.R10k, InventedMeter.One, options);
        var a = run.Final.Acceptance!;
        Assert.True(run.ReadingsUsed > 9, $"accepted after {run.ReadingsUsed} readings");
        Assert.InRange(a.ResidualHalfWidth, 1e-6, 0.05);
    }

    [Fact]
    public void Options_SpanWithoutTimeConstant_ThrowsNamingBoth()
    {
        var options = new SettleOptions { SettlingSpan = TimeSpan.FromSeconds(4), AssumedTimeConstant = TimeSpan.Zero };
        var e = Assert.Throws<ArgumentException>(() => Tracker(options));
        Assert.Contains("SettlingSpan", e.Message, StringComparison.Ordinal);
        Assert.Contains("AssumedTimeConstant", e.Message, StringComparison.Ordinal);
        Assert.Throws<ArgumentOutOfRangeException>(() => new SettleOptions { SettlingSpan = TimeSpan.FromMinutes(11) });
        Assert.Throws<ArgumentOutOfRangeException>(() =>
            new SettleOptions { AssumedTimeConstant = TimeSpan.FromSeconds(-1) }
        );
    }
}
