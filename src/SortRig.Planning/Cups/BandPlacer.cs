using MathNet.Numerics.Distributions;
using MathNet.Numerics.Statistics;

namespace SortRig.Planning.Cups;

/// <summary>
/// Places bands of a fixed width where most parts will fall: the learned deviations are smoothed by a Gaussian
/// kernel (Silverman's rule-of-thumb bandwidth, 0.9 min(σ, IQR/1.34) n^(−1/5), from memory; at most a quarter band),
/// and a dynamic
/// programme over start points on a grid of width/8 picks the non-overlapping bands (avoiding bands already holding
/// parts) whose total probability is largest.
/// </summary>
internal static class BandPlacer
{
    private static readonly int s_stepsPerBand = 8;

    public static List<(double Lo, double Hi)> Place(IReadOnlyList<double> samples, IReadOnlyList<(double Lo, double Hi)> pinned, int free, double width, double range, double anchor)
    {
        var step = width / s_stepsPerBand;
        var first = anchor - (Math.Ceiling((anchor + range + width) / step) * step);
        var starts = new List<double>();
        for (var a = first; a <= range; a += step)
        {
            starts.Add(a);
        }

        var sigma = samples.StandardDeviation();
        var iqr = samples.InterquartileRange();
        var spread = Math.Min(sigma, iqr > 0 ? iqr / 1.34 : sigma);
        // Capped at a quarter band: the rule of thumb over-smooths a reel with its centre missing.
        var h = spread > 0 ? Math.Min(0.9 * spread * Math.Pow(samples.Count, -0.2), width / 4) : width / 4;
        var cover = starts.Select(a => samples.Sum(x => Normal.CDF(x, h, a + width) - Normal.CDF(x, h, a)) / samples.Count).ToArray();
        var ok = starts.Select(a => pinned.All(p => a + width <= p.Lo + 1e-9 || a >= p.Hi - 1e-9)).ToArray();

        var g = starts.Count;
        var best = new double[g + s_stepsPerBand + 1, free + 1];
        for (var i = g - 1; i >= 0; i--)
        {
            for (var f = 1; f <= free; f++)
            {
                best[i, f] = best[i + 1, f];
                if (ok[i])
                {
                    best[i, f] = Math.Max(best[i, f], cover[i] + best[i + s_stepsPerBand, f - 1]);
                }
            }
        }

        var bands = new List<(double, double)>();
        for (int i = 0, f = free; i < g && f > 0;)
        {
            if (ok[i] && cover[i] + best[i + s_stepsPerBand, f - 1] >= best[i + 1, f])
            {
                bands.Add((starts[i], starts[i] + width));
                i += s_stepsPerBand;
                f--;
            }
            else
            {
                i++;
            }
        }

        return bands;
    }
}
