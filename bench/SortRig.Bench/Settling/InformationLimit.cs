namespace SortRig.Bench.Settling;

/// <summary>
/// The information limit: an oracle that knows the part's settling curve and the meter's noise (the simulator's
/// truth) and takes the mean of the most recent k readings. It stops at the first reading n (after the contact
/// bounce) for which some k gives a root-mean-square error within the target:
/// sqrt(b_k(n)² + σ²/k) ≤ target, where b_k(n) = mean of the noise-free values of readings n−k+1..n minus the
/// settled truth, and σ² = noise² + step²/12 is the variance of one quantised reading. No realisable rule that
/// averages recent readings can stop earlier with that error.
/// </summary>
internal static class InformationLimit
{
    public static RuleOutcome Run(
        Insertion insertion,
        double targetPpm,
        double readingSigmaOhms,
        TimeSpan bounce,
        TimeSpan horizon
    )
    {
        var target = targetPpm * 1e-6 * insertion.Truth;
        var target2 = target * target;
        var sigma2 = readingSigmaOhms * readingSigmaOhms;
        var first = insertion.FirstEndingAtOrAfter(bounce);
        var last = insertion.FirstEndingAtOrAfter(horizon);
        for (var n = first; n <= last; n++)
        {
            var excess = insertion.Clean(n) - insertion.Truth;
            if (Math.Abs(excess) > target)
            {
                continue; // the excess decays monotonically: every mean ending at n is at least this far off
            }

            double sum = 0;
            for (var k = 1; k <= n - first + 1; k++)
            {
                sum += insertion.Clean(n - k + 1) - insertion.Truth;
                var bias = sum / k;
                if ((bias * bias) + (sigma2 / k) <= target2)
                {
                    return RuleOutcome.Timed(insertion.Since(n).TotalSeconds, n + 1);
                }

                if (bias * bias > target2)
                {
                    break;
                }
            }
        }

        return RuleOutcome.Unstable(insertion.Since(last).TotalSeconds, last + 1);
    }
}
