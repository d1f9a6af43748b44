using MathNet.Numerics.Distributions;

namespace SortRig.Measurement.Settling;

/// <summary>
/// A level-shift (change-point) test for the averaging rule's settling span: a quadratic in time (the slow curvature
/// of a recovery still under way) against the same quadratic plus a step at an unknown reading k, k chosen by least
/// squares. The largest drop of the residual sum, over the step model's own residual variance, is compared with χ²₁ at
/// the Bonferroni level α / (positions tried): the maximum-likelihood test of one change in mean at an unknown
/// position (Page 1954; Basseville and Nikiforov 1993, ch. 2; the Bonferroni bound for the unknown position is
/// common practice, no source; all from memory). A popcorn step of the part (a few ppm, in a few milliseconds)
/// against a recovery flattens a straight line through the span, and the slope that bounds the recovery still to
/// come then reads too small; a quadratic cannot follow a step, so the step shows here.
/// </summary>
internal static class ChangePoint
{
    /// <summary>Least readings on each side of a step: fewer cannot tell a step from one outlying reading.</summary>
    public const int MinSegment = 3;

    /// <summary>
    /// Index of the first reading after the most likely step when that step is significant at
    /// <paramref name="alpha"/> over all positions; −1 when none is, or the record is too short to test.
    /// </summary>
    /// <param name="t">Times, s, ascending.</param>
    /// <param name="y">Values.</param>
    /// <param name="floorVariance">Least variance of one reading (quantisation).</param>
    /// <param name="alpha">Significance over all positions.</param>
    public static int Locate(ReadOnlySpan<double> t, ReadOnlySpan<double> y, double floorVariance, double alpha)
    {
        var n = t.Length;
        if (n < (2 * MinSegment) + 4)
        {
            return -1;
        }

        var centre = (t[0] + t[n - 1]) / 2;
        var half = (t[n - 1] - t[0]) / 2;
        if (!(half > 0))
        {
            return -1;
        }

        var mean = 0.0;
        foreach (var v in y)
        {
            mean += v;
        }

        mean /= n;
        // Normal equations of the quadratic on x = (t − centre)/half in [−1, 1] and y − mean (well conditioned).
        const int m = 3;
        Span<double> g = stackalloc double[m * m];
        Span<double> h = stackalloc double[m];
        Span<double> row = stackalloc double[m];
        var rows = new double[n * m];
        var yc = new double[n];
        var yy = 0.0;
        for (var i = 0; i < n; i++)
        {
            var x = (t[i] - centre) / half;
            (row[0], row[1], row[2]) = (1, x, x * x);
            yc[i] = y[i] - mean;
            yy += yc[i] * yc[i];
            for (var a = 0; a < m; a++)
            {
                rows[(i * m) + a] = row[a];
                h[a] += row[a] * yc[i];
                for (var b = 0; b < m; b++)
                {
                    g[(a * m) + b] += row[a] * row[b];
                }
            }
        }

        var rssNull = Rss(g, h, yy, m);
        if (!double.IsFinite(rssNull))
        {
            return -1;
        }

        // Suffix sums give the normal equations with the step column (1 from reading k on) in O(1) per k.
        const int w = m + 1;
        Span<double> suffix = stackalloc double[m];
        Span<double> big = stackalloc double[w * w];
        Span<double> rhs = stackalloc double[w];
        var (suffixY, count, best, bestK) = (0.0, 0, double.PositiveInfinity, -1);
        for (var k = n - 1; k >= MinSegment; k--)
        {
            for (var a = 0; a < m; a++)
            {
                suffix[a] += rows[(k * m) + a];
            }

            suffixY += yc[k];
            count++;
            if (count < MinSegment)
            {
                continue;
            }

            for (var a = 0; a < m; a++)
            {
                for (var b = 0; b < m; b++)
                {
                    big[(a * w) + b] = g[(a * m) + b];
                }

                big[(a * w) + m] = suffix[a];
                big[(m * w) + a] = suffix[a];
                rhs[a] = h[a];
            }

            big[(m * w) + m] = count;
            rhs[m] = suffixY;
            var rss = Rss(big, rhs, yy, w);
            if (rss < best)
            {
                (best, bestK) = (rss, k);
            }
        }

        if (bestK < 0)
        {
            return -1;
        }

        var positions = n - (2 * MinSegment) + 1;
        var variance = Math.Max(best / (n - w), floorVariance);
        var threshold = ChiSquared.InvCDF(1, 1 - (alpha / positions));
        return variance > 0 && (rssNull - best) / variance > threshold ? bestK : -1;
    }

    /// <summary>yy − βᵀh of the least-squares solution (∞ when singular), floored at 0.</summary>
    private static double Rss(ReadOnlySpan<double> g, ReadOnlySpan<double> h, double yy, int m)
    {
        Span<double> gg = stackalloc double[m * m];
        Span<double> hh = stackalloc double[m];
        g.CopyTo(gg);
        h.CopyTo(hh);
        var beta = new double[m];
        if (!ExponentialFitter.Solve(gg, hh, beta, m))
        {
            return double.PositiveInfinity;
        }

        var fitted = 0.0;
        for (var a = 0; a < m; a++)
        {
            fitted += beta[a] * h[a];
        }

        return Math.Max(0, yy - fitted);
    }
}
