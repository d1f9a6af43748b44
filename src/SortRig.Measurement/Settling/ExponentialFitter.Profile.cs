namespace SortRig.Measurement.Settling;

/// <summary>
/// Profile-likelihood interval of the asymptote (Venzon and Moolgavkar 1988; Bates and Watts 1988 ch. 6, from
/// memory): the set of time constants whose residual sum exceeds the minimum by at most χ²₁ s² (see
/// <see cref="ChiSquareThreshold"/>), projected onto A. Unlike the linearised covariance at the estimate, it sees that a short record of a slow
/// exponential cannot tell a 1 s from a 4 s time constant, and so cannot pin the asymptote.
/// </summary>
internal static partial class ExponentialFitter
{
    /// <summary>
    /// χ²₁ at 1 − 0.05/20: the rule looks at a recovery about 20 times before it accepts, so each look's interval is
    /// widened by Bonferroni's correction to keep 95 % coverage over the looks (z = 3.02).
    /// </summary>
    public const double ChiSquareThreshold = 9.141;

    /// <summary>√<see cref="ChiSquareThreshold"/>: the matching multiple of a linearised standard uncertainty.</summary>
    public const double Z = 3.0234;

    /// <summary>
    /// The profile interval of A (lowest, highest), at the Bonferroni-corrected level. Time constants are searched within [tauMin, tauMax]: the
    /// upper bound is the physical assumption that no part recovers more slowly (SettleOptions.AssumedTimeConstant).
    /// </summary>
    public static (double Low, double High) ProfileInterval(ReadOnlySpan<double> t, ReadOnlySpan<double> y, ExponentialFit best, double s2, double tauMin, double tauMax)
    {
        double[] tt = t.ToArray(), yy = y.ToArray();
        var threshold = best.Rss + (ChiSquareThreshold * s2);
        var (lo, hi) = (Math.Log(tauMin), Math.Log(tauMax));
        var (aMin, aMax) = (best.Final, best.Final);
        var uBest = Math.Log(best.TimeConstants[^1]);
        if (best.Model == RecoveryModel.TwoExponentials)
        {
            // Two exponentials: the profile over the slow time constant may have more than one basin (a tiny fast
            // term fitting the first readings, or the real fast path), so the whole range is scanned.
            var points = new List<(double Rss, double A)> { (best.Rss, best.Final) };
            for (var u = lo + Math.Log(1.5) + 0.05; u <= hi + 1e-9; u += 0.1)
            {
                points.AddRange(Profiled(tt, yy, best, Math.Exp(Math.Min(u, hi)), tauMin));
            }

            points.AddRange(Profiled(tt, yy, best, tauMax, tauMin));
            var floor = points.Min(q => q.Rss) + (ChiSquareThreshold * s2);
            var inside = points.Where(q => q.Rss <= floor).ToList();
            return (inside.Min(q => q.A), inside.Max(q => q.A));
        }

        var maxStep = best.Model == RecoveryModel.OneExponential ? 0.05 : 0.1;
        foreach (var direction in new[] { -1, 1 })
        {
            // Steps grow from 0.005 in ln τ (a sharply defined τ still shows its interval) to maxStep.
            var outside = 0;
            var atBound = false;
            var (u, step) = (uBest, 0.005);
            while (outside < 3 && !atBound)
            {
                u += direction * step;
                step = Math.Min(maxStep, step * 1.5);
                if (u <= lo || u >= hi)
                {
                    u = Math.Clamp(u, lo, hi);
                    atBound = true; // the bound itself is the last point looked at
                }

                var inside = false;
                foreach (var (rss, a) in Profiled(tt, yy, best, Math.Exp(u), tauMin))
                {
                    if (rss <= threshold)
                    {
                        inside = true;
                        (aMin, aMax) = (Math.Min(aMin, a), Math.Max(aMax, a));
                    }
                }

                outside = inside ? 0 : outside + 1;
            }
        }

        return (aMin, aMax);
    }

    /// <summary>Residual sums and asymptotes at a given slowest time constant (and, for two exponentials, a grid of fast ones).</summary>
    private static IEnumerable<(double Rss, double A)> Profiled(double[] t, double[] y, ExponentialFit best, double slow, double tauMin)
    {
        if (best.Model == RecoveryModel.OneExponential)
        {
            var rssOne = Project(t, y, [slow], out var betaOne);
            yield return (rssOne, betaOne[0]);
            yield break;
        }

        // The fast time constant minimising the residual sum at this slow one (grid, then golden section): the profile.
        var top = slow / 1.5;
        if (top <= tauMin)
        {
            yield break;
        }

        var (lo, hi) = (Math.Log(tauMin), Math.Log(top));
        double Rss(double u) => Project(t, y, [Math.Exp(u), slow], out _);
        var fast = Math.Exp(GridThenGolden(Rss, lo, hi, 6, 0.02));
        var rss = Project(t, y, [fast, slow], out var beta);
        yield return (rss, beta[0]);
    }
}
