using MathNet.Numerics.Distributions;

namespace SortRig.Planning.Cups;

/// <summary>
/// How many of the coming parts a band starting at each grid point would take, from the parts seen so far: a
/// Gaussian kernel density of the part centres on the log scale (bandwidth by leave-one-out likelihood
/// cross-validation under the caller's cap, see <c>Bandwidth</c>; kernels reflected at a binned-out centre's edge
/// when one is given), where a part counts only when its whole uncertainty interval
/// [centre − h, centre + h] fits the band (the worst case of the matched rule).
/// </summary>
internal static class CoverageEstimate
{
    /// <param name="samples">Centre and half-width of each part seen, log ppm.</param>
    /// <param name="firstStart">Log ppm of grid point 0.</param>
    /// <param name="step">Grid step, log ppm.</param>
    /// <param name="points">Grid points.</param>
    /// <param name="width">Band width, log ppm.</param>
    /// <param name="cap">Largest kernel bandwidth, log ppm.</param>
    /// <param name="covered">Bands already holding parts (log ppm edges, ascending by low edge; they may overlap):
    /// a part one of them would take is not counted again.</param>
    /// <param name="hole">Half-width of a hole around the nominal with no parts (log ppm), 0 for none: kernels are
    /// reflected at its edges (<see cref="Kernel"/>).</param>
    /// <returns>Expected share of the coming parts each band would take (0..1).</returns>
    public static double[] Gains(
        IReadOnlyList<(double Centre, double Half)> samples,
        double firstStart,
        double step,
        int points,
        double width,
        double cap,
        IReadOnlyList<(double Lo, double Hi)>? covered = null,
        double hole = 0
    )
    {
        var gains = new double[points];
        if (samples.Count == 0)
        {
            return gains;
        }

        var h = Bandwidth(samples.Select(s => s.Centre).ToList(), cap);
        foreach (var (c, half) in samples)
        {
            var lo = Math.Max(0, (int)Math.Floor((c - width - (6 * h) - firstStart) / step));
            var hi = Math.Min(points - 1, (int)Math.Ceiling((c + (6 * h) - firstStart) / step));
            for (var j = lo; j <= hi; j++)
            {
                var s = firstStart + (j * step);
                var a = s + half;
                var b = s + width - half;
                if (b > a)
                {
                    var cdf = Kernel(c, h, hole);
                    gains[j] += cdf(b) - cdf(a);
                    gains[j] -= Covered(cdf, a, b, half, covered ?? []);
                }
            }
        }

        for (var j = 0; j < points; j++)
        {
            gains[j] /= samples.Count;
        }

        return gains;
    }

    /// <summary>
    /// Distribution function of one part's kernel N(c, h). With a hole (no part has |x| &lt; g), the kernel of a part
    /// at c ≥ g is reflected at the hole's edge, its mass below g folded back above it (the reflection method for a
    /// density with a known boundary, Silverman 1986 sec. 2.10, from memory), so that the estimate neither leaks into
    /// the hole nor thins out at its edge, where such a reel is densest; likewise at −g for c ≤ −g. The small mass
    /// beyond the other edge is left as it is.
    /// </summary>
    /// <param name="c">The part's centre, log ppm.</param>
    /// <param name="h">Bandwidth, log ppm.</param>
    /// <param name="g">The hole's half-width, log ppm; 0 for none.</param>
    internal static Func<double, double> Kernel(double c, double h, double g)
    {
        if (g <= 0 || Math.Abs(c) < g)
        {
            return x => Normal.CDF(c, h, x);
        }

        // Mass of N(c, h) reflected at g on (−∞, x], for c ≥ g.
        double Upper(double cc, double x) =>
            x <= -g ? Normal.CDF(cc, h, x)
            : x < g ? Normal.CDF(cc, h, -g)
            : Normal.CDF(cc, h, -g)
                + (Normal.CDF(cc, h, x) - Normal.CDF(cc, h, g))
                + (Normal.CDF((2 * g) - cc, h, x) - Normal.CDF((2 * g) - cc, h, g));
        return c >= g ? x => Upper(c, x) : x => 1 - Upper(-c, -x);
    }

    /// <summary>
    /// Probability (by <paramref name="cdf"/>) that a centre in [a, b] also fits one of the covered bands: a part of
    /// half-width <paramref name="half"/> fits band [lo, hi] when its centre is in [lo + half, hi − half]; those
    /// intervals are merged first, so overlapping bands are counted once.
    /// </summary>
    /// <param name="cdf">Distribution function of the centre.</param>
    /// <param name="a">Low end, log ppm.</param>
    /// <param name="b">High end, log ppm.</param>
    /// <param name="half">Half-width of the part's uncertainty interval, log ppm.</param>
    /// <param name="covered">Bands, ascending by low edge.</param>
    public static double Covered(
        Func<double, double> cdf,
        double a,
        double b,
        double half,
        IReadOnlyList<(double Lo, double Hi)> covered
    )
    {
        var mass = 0.0;
        var (lo, hi) = (double.NegativeInfinity, double.NegativeInfinity);
        foreach (var band in covered.Append((double.PositiveInfinity, double.PositiveInfinity)))
        {
            var (l, h) = (band.Item1 + half, band.Item2 - half);
            if (h <= l && !double.IsPositiveInfinity(l))
            {
                continue;
            }

            if (l <= hi)
            {
                hi = Math.Max(hi, h);
                continue;
            }

            var (x, y) = (Math.Max(a, lo), Math.Min(b, hi));
            if (y > x)
            {
                mass += cdf(y) - cdf(x);
            }

            (lo, hi) = (l, h);
        }

        return mass;
    }

    // Leave-one-out likelihood cross-validation over a geometric grid of bandwidths from a twentieth of the cap up to
    // the cap (textbook bandwidth selection, e.g. Silverman 1986 sec. 3.4.4, from memory), on at most 150 evenly spaced
    // parts, scaled to the full sample by the n^(−1/5) rate. Unlike the normal rule of thumb it does not blur a reel
    // whose centre was binned out.
    private static double Bandwidth(List<double> centres, double cap)
    {
        if (centres.Count < 3)
        {
            return cap;
        }

        var stride = Math.Max(1, centres.Count / 150);
        var x = centres.Where((_, i) => i % stride == 0).ToArray();
        double best = double.NegativeInfinity,
            chosen = cap;
        for (var h = cap / 20; h <= cap * 1.0001; h *= 1.25)
        {
            var score = 0.0;
            for (var i = 0; i < x.Length; i++)
            {
                var sum = 0.0;
                for (var j = 0; j < x.Length; j++)
                {
                    if (j != i)
                    {
                        var z = (x[i] - x[j]) / h;
                        sum += Math.Exp(-0.5 * z * z);
                    }
                }

                score += Math.Log((sum / h) + 1e-300);
            }

            if (score > best)
            {
                (best, chosen) = (score, h);
            }
        }

        return chosen * Math.Pow((double)x.Length / centres.Count, 0.2);
    }
}
