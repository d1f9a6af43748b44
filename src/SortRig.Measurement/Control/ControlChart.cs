using System.Globalization;

namespace SortRig.Measurement.Control;

/// <summary>
/// Judges the newest point of a series against fixed limits: Western Electric rules 1, 2 and 4
/// (Western Electric Statistical Quality Control Handbook, 1956; as listed in NIST/SEMATECH
/// e-Handbook sec. 6.3.2), the moving-range chart and the EWMA chart for slow drift.
/// </summary>
public static class ControlChart
{
    /// <summary>Verdict on the last of <paramref name="points"/>, the points judged against these limits so
    /// far.</summary>
    /// <param name="limits">Limits set from history.</param>
    /// <param name="points">Points since the limits were set, oldest first; at least 1, all finite.</param>
    /// <param name="ewma">EWMA options; default <see cref="EwmaOptions.Default"/>.</param>
    public static ControlVerdict Judge(ChartLimits limits, IReadOnlyList<double> points, EwmaOptions? ewma = null)
    {
        ArgumentNullException.ThrowIfNull(limits);
        ArgumentNullException.ThrowIfNull(points);
        if (points.Count == 0)
        {
            throw new ArgumentException("There must be a point to judge.", nameof(points));
        }

        ewma ??= EwmaOptions.Default;
        int n = points.Count;
        double x = points[n - 1];
        if (!double.IsFinite(x))
        {
            throw new ArgumentException("The point must be finite.", nameof(points));
        }

        double sigma = limits.Sigma;
        double score = (x - limits.Centre) / sigma;
        double[] z = Ewma.Statistics(points, limits.Centre, ewma.Lambda);
        double half = Ewma.HalfWidth(n, sigma, ewma);
        ControlVerdict Verdict(ControlRule rule, string reason) =>
            new(rule == ControlRule.None, rule, reason, x, score, z[n - 1], half);

        if (x > limits.Upper || x < limits.Lower)
        {
            return Verdict(
                ControlRule.BeyondThreeSigma,
                Text($"the check read {score:+0.0;-0.0} sigma from its centre, beyond the 3-sigma limits")
            );
        }

        if (n >= 2 && Math.Abs(x - points[n - 2]) > limits.MovingRangeUpper)
        {
            double moved = Math.Abs(x - points[n - 2]),
                limit = limits.MovingRangeUpper;
            return Verdict(
                ControlRule.MovingRangeAboveLimit,
                Text($"the check moved {moved:G4} since the last check, above the moving-range limit {limit:G4}")
            );
        }

        if (TwoOfThree(points, limits))
        {
            return Verdict(
                ControlRule.TwoOfThreeBeyondTwoSigma,
                "two of the last three checks read beyond 2 sigma on the same side"
            );
        }

        if (EightOnOneSide(points, limits.Centre))
        {
            return Verdict(ControlRule.EightOnOneSide, "eight checks in a row read on the same side of the centre");
        }

        if (Math.Abs(z[n - 1] - limits.Centre) > half)
        {
            double drift = (z[n - 1] - limits.Centre) / sigma;
            return Verdict(
                ControlRule.EwmaBeyondLimits,
                Text($"the checks' weighted average drifted {drift:+0.00;-0.00} sigma, beyond its limits")
            );
        }

        return Verdict(ControlRule.None, string.Empty);
    }

    private static bool TwoOfThree(IReadOnlyList<double> points, ChartLimits limits)
    {
        int n = points.Count;
        if (n < 2)
        {
            return false;
        }

        double last = points[n - 1] - limits.Centre;
        if (Math.Abs(last) <= 2 * limits.Sigma)
        {
            return false; // the newest point must be one of the two, else an older verdict already said so
        }

        int beyond = 0;
        for (int i = Math.Max(0, n - 3); i < n; i++)
        {
            double d = points[i] - limits.Centre;
            if (Math.Sign(d) == Math.Sign(last) && Math.Abs(d) > 2 * limits.Sigma)
            {
                beyond++;
            }
        }

        return beyond >= 2;
    }

    private static bool EightOnOneSide(IReadOnlyList<double> points, double centre)
    {
        int n = points.Count;
        if (n < 8)
        {
            return false;
        }

        int side = Math.Sign(points[n - 1] - centre);
        if (side == 0)
        {
            return false;
        }

        for (int i = n - 8; i < n; i++)
        {
            if (Math.Sign(points[i] - centre) != side)
            {
                return false;
            }
        }

        return true;
    }

    private static string Text(FormattableString text) => text.ToString(CultureInfo.InvariantCulture);
}
