using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Settling;

/// <summary>
/// What the settle rule can resolve for a part that has fully settled, on one range and NPLC, from the meter
/// spec alone (before any reading): the target must sit above these floors or no window ever passes. Pure.
/// See docs/measurement.md, "Settle target".
/// </summary>
/// <param name="ReadingSigma">σ₁ of one reading, ohms: √(noise² + step²/12) (noise = spec'd RMS noise of range,
/// step = resolution; GUM F.2.2.1 for the quantisation term).</param>
/// <param name="Sem">Noise-limited standard error of the window mean, σ₁/√N, ohms.</param>
/// <param name="SlopeFloor">Expected value, for a flat noisy signal, of what the slope criterion compares with the
/// target, ohms: with a settling span, the residual half-width a = (E|b| + t·SE(b)) × τa × e^(−lag/τa); without,
/// E|b| × window duration / SlopeFractionOfTarget. E|b| = √(2/π)·SE(b) (half-normal mean).</param>
public sealed record SettleReach(double ReadingSigma, double Sem, double SlopeFloor)
{
    /// <summary>The larger floor, ohms: the smallest target the rule can reach on average.</summary>
    public double Floor => Math.Max(Sem, SlopeFloor);

    /// <summary>Predicts the floors for readings on <paramref name="range"/> at <paramref name="nplc"/>, taken back
    /// to back at the spec'd reading rate, judged with <paramref name="options"/>.</summary>
    public static SettleReach Predict(RangeSpec range, NplcSpec nplc, SettleOptions options)
    {
        ArgumentNullException.ThrowIfNull(range);
        ArgumentNullException.ThrowIfNull(nplc);
        ArgumentNullException.ThrowIfNull(options);
        var step = nplc.Resolution(range.FullScale);
        var noise = nplc.NoisePpmOfRange * 1e-6 * range.FullScale;
        var sigma = Math.Sqrt((noise * noise) + (step * step / 12));
        var n = options.WindowLength;
        var sem = sigma / Math.Sqrt(n);
        if (!(nplc.ReadingsPerSecond > 0))
        {
            return new SettleReach(sigma, sem, 0);
        }

        var period = 1 / nplc.ReadingsPerSecond;
        var tau = options.AssumedTimeConstant.TotalSeconds;
        var halfNormalMean = Math.Sqrt(2 / Math.PI);
        if (options.SettlingSpan > TimeSpan.Zero && tau > 0)
        {
            // The span holds the readings of the last SettlingSpan, never fewer than the window.
            var m = Math.Max(n, (int)Math.Floor((options.SettlingSpan.TotalSeconds / period) + 1e-9) + 1);
            var se = sigma / Math.Sqrt(Sxx(m, period));
            var t = WindowStatistics.CriticalT(m, options.SlopeAlpha);
            var lag = (m - n) * period / 2;
            return new SettleReach(sigma, sem, (halfNormalMean + t) * se * tau * Math.Exp(-lag / tau));
        }

        var slopeError = sigma / Math.Sqrt(Sxx(n, period));
        var excursion = halfNormalMean * slopeError * (n - 1) * period;
        return new SettleReach(sigma, sem, excursion / options.SlopeFractionOfTarget);
    }

    // Σ(t − t̄)² of m evenly spaced times: p² m (m² − 1) / 12.
    private static double Sxx(int m, double period) => period * period * m * ((double)m * m - 1) / 12;
}
