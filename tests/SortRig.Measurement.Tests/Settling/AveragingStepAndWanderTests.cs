using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;
using static SortRig.Measurement.Tests.Settling.ReadingScript;

namespace SortRig.Measurement.Tests.Settling;

/// <summary>
/// The averaging rule's settling span against the two kinds of non-white noise a handled part shows (issue #13,
/// sixth pass): a popcorn step inside the span, which the span restarts after (<see cref="ChangePoint"/>), and a slow
/// wander, which the span slope's standard error is inflated for (batch means). A reading every 41 ms (1 NPLC), 10
/// kOhm, target 5 ppm, span 4 s, assumed τ 5 s: the sort's options.
/// </summary>
public sealed class AveragingStepAndWanderTests
{
    private const double Dt = 0.041;
    private const double R = ReadingScript.Range;
    private const double TargetPpm = 5;

    private static SettleOptions Averaging =>
        SettleOptions.Default with
        {
            Target = SettleTarget.Ppm(TargetPpm),
            MaxSettleTime = TimeSpan.FromSeconds(40),
            SettlingSpan = TimeSpan.FromSeconds(4),
        };

    [Theory]
    [InlineData(1, 5.0)]
    [InlineData(2, 6.5)]
    [InlineData(3, 8.0)]
    public void StepAgainstTheRecovery_SpanRestarts_RecoveryLeftWithinTwiceTarget(int seed, double stepAt)
    {
        // A part cooling from 60 ppm with 4 s (0.5 ppm white noise) jumps up by 8 ppm (a popcorn step) while it still
        // falls: a straight line through a span holding the step is flattened (Page 1954: one change in mean at an
        // unknown position, from memory), so the slope reads a recovery nearly over. What the part settles to is the
        // level after the step; the accepted value must lie within 2 × target of it. (The span's wander inflation
        // alone holds these too: the step leaves the line's residuals correlated. The restart's own check is below.)
        var noise = Gaussian(seed, 0.005);
        var readings = Sampled(0, Dt, 1000, t =>
            (R * (1 + (60e-6 * Math.Exp(-t / 4)))) + (t >= stepAt ? 8e-6 * R : 0) + noise()
        );

        var accepted = Tracker(Averaging).Feed(readings).First(v => v.State == SettleState.Accepted).Acceptance!;

        Assert.InRange((accepted.Value.Value / (R * (1 + 8e-6))) - 1, -2 * TargetPpm * 1e-6, 2 * TargetPpm * 1e-6);
    }

    [Fact]
    public void StepInSpan_RestartDropsTheReadingsBeforeIt()
    {
        // A settled part (0.5 ppm noise) that steps by 4 ppm (a popcorn step) 70 readings into a span of 97: the span
        // restarts at the step, so the slope is read from one level only; a second look finds no step left.
        var noise = Gaussian(3, 0.005);
        var residual = new ResidualSettling(Averaging, 0.0001);
        for (var i = 0; i < 97; i++)
        {
            residual.Add(At(i * Dt, R + (i >= 70 ? 4e-6 * R : 0) + noise()), 8);
        }

        Assert.True(residual.RestartAfterStep(0.05));
        Assert.Equal(97 - 70, residual.Count);
        Assert.False(residual.RestartAfterStep(0.05));
    }

    [Fact]
    public void SmoothRecovery_NoStepFound()
    {
        // The test's null is a quadratic: the curvature of a recovery still under way where the rule would accept (60
        // ppm, 4 s, a 4 s span from 6 s: 13 ppm left at its start) is not taken for a step (Bonferroni over the
        // positions at 5 %: 20 seeded records, at most 2 false).
        var found = 0;
        for (var seed = 1; seed <= 20; seed++)
        {
            var noise = Gaussian(seed, 0.005);
            var t = Enumerable.Range(0, 98).Select(i => 6 + (i * Dt)).ToArray();
            var y = t.Select(x => (R * 60e-6 * Math.Exp(-x / 4)) + noise()).ToArray();
            found += ChangePoint.Locate(t, y, 1e-8, 0.05) >= 0 ? 1 : 0;
        }

        Assert.InRange(found, 0, 2);
    }

    [Fact]
    public void Step_LocatedAtItsReading()
    {
        var noise = Gaussian(5, 0.005);
        var t = Enumerable.Range(0, 98).Select(i => i * Dt).ToArray();
        var y = t.Select((x, i) => (R * 20e-6 * Math.Exp(-x / 4)) + (i >= 60 ? 0.04 : 0) + noise()).ToArray();

        Assert.Equal(60, ChangePoint.Locate(t, y, 1e-8, 0.05));
    }

    [Fact]
    public void SlowWander_SpanSlopeBoundCoversTheTrueSlope()
    {
        // A line of known slope (0.5 ppm/s) under white noise (0.5 ppm) plus a slow Gauss-Markov wander (AR(1), 0.5
        // ppm, correlation time 0.3 s): the bound a = (|b| + t·SE(b)) τ e^(−lag/τ) must hold |true slope| τ e^(−lag/τ)
        // in about 97.5 % of records (one side of a 95 % t interval). With SE(b) of white scatter it holds far less
        // often: the slope of a line through correlated noise varies more than white scatter says (the AR(1) long-run
        // variance, Box and Jenkins; batch means, Schmeiser 1982; from memory). 400 seeded records.
        const double slope = 0.5e-6 * R;
        const int records = 400;
        var tau = Averaging.AssumedTimeConstant.TotalSeconds;
        var critical = WindowStatistics.CriticalT(98, 0.05);
        var (held, heldWhite) = (0, 0);
        for (var seed = 1; seed <= records; seed++)
        {
            var white = Gaussian(seed, 0.005);
            var drive = Gaussian(seed + 10_000, 1);
            var rho = Math.Exp(-Dt / 0.3);
            var wander = 0.0;
            var residual = new ResidualSettling(Averaging, 0.0001);
            var readings = new List<Reading>();
            for (var i = 0; i < 97; i++)
            {
                wander = (rho * wander) + (Math.Sqrt(1 - (rho * rho)) * 0.005 * drive());
                var reading = At(i * Dt, R - (slope * i * Dt) + wander + white());
                readings.Add(reading);
                residual.Add(reading, 8);
            }

            var window = readings.TakeLast(8).ToArray();
            var stats = WindowStatistics.Of(window, WindowStatistics.CriticalT(8, 0.05))!.Value;
            var a = residual.HalfWidth(stats, WindowStatistics.CriticalT(8, 0.05), window);
            var lag =
                window.Average(r => (r.Time - Start).TotalSeconds)
                - readings.Average(r => (r.Time - Start).TotalSeconds);
            var decay = tau * Math.Exp(-lag / tau);
            held += a >= slope * decay ? 1 : 0;

            // The same bound with the white-scatter SE(b) of the whole record (MathNet-free: the textbook formulas).
            var line = WindowStatistics.Of(readings, critical)!.Value;
            heldWhite += (Math.Abs(line.Slope) + (critical * line.SlopeStandardError)) >= slope ? 1 : 0;
        }

        Assert.True(held >= 0.9 * records, $"{held} of {records} held (white SE: {heldWhite})");
        Assert.True(
            heldWhite < 0.85 * records,
            $"white SE held {heldWhite} of {records}: the wander is too weak to test"
        );
    }
}
