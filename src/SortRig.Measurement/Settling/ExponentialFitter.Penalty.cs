namespace SortRig.Measurement.Settling;

/// <summary>
/// The asymptote under a reel-learned distribution of the body time constant (<see cref="BodyPrior"/>), taken as
/// prior information that adds to the record's: y(t) = A + B_lead e^(−t/τ_lead) + B_body e^(−t/τ_body), τ_lead free
/// below τ_body / 1.5, amplitudes of one sign, τ_body at most the assumed longest time constant, and the deviance of
/// the prior on ln τ_body added to RSS / s² (a penalised, i.e. posterior-mode, profile likelihood; Bates and Watts
/// 1988 sec. 3.5.5 for the conditionally linear profile, from memory). At given time constants the model is linear,
/// so the penalised deviance at A is Q(τ) + (A − Â(τ))² / (c(τ) s²), Q(τ) = RSS(τ)/s² + penalty(τ_body), and the
/// interval is the union over a grid of time constants of Â(τ) ± √((Q_min + threshold − Q(τ)) c(τ) s²). This is the
/// rule's counterpart of the fit limit's prior column, whose Bayesian information adds the prior's 1/sd² to the
/// data's (Van Trees): a body the part's own record and the reel's spread both allow counts, not every body of the
/// range whatever the record says.
/// </summary>
internal static partial class ExponentialFitter
{
    /// <summary>
    /// The interval of A (lowest, highest) at the small-sample Bonferroni level (<see cref="Threshold"/>), the least
    /// penalised deviance <paramref name="bestDeviance"/> (RSS / s² + penalty, at asymptote <paramref
    /// name="bestFinal"/> and body <paramref name="bestBody"/>); infinite when the record cannot bound A. The body grid
    /// covers the bodies whose penalty alone is within the threshold plus χ²₁(5 %) of the centre: a look the prior-data
    /// conflict test passes (the caller's) has Q_min within χ²₁(5 %) of the free fit's RSS / s², so a body beyond
    /// cannot enter the interval.
    /// </summary>
    public static (double Low, double High) PenalizedInterval(
        ReadOnlySpan<double> t,
        ReadOnlySpan<double> y,
        double s2,
        double tauMin,
        double tauMax,
        BodyPrior prior,
        double conflictChiSquare,
        out double bestDeviance,
        out double bestFinal,
        out double bestBody,
        double looks = DefaultLooks
    )
    {
        var n = t.Length;
        var threshold = Threshold(n - 5, looks);
        var reach = prior.Reach(threshold + conflictChiSquare) * prior.LogScale;
        var (lowBody, highBody) = (
            Math.Max(prior.LogMean - reach, Math.Log(tauMin * 1.5)),
            Math.Min(prior.LogMean + reach, Math.Log(tauMax))
        );
        (bestDeviance, bestFinal, bestBody) = (double.PositiveInfinity, double.NaN, double.NaN);
        if (!(lowBody < highBody) || !(s2 > 0))
        {
            return (double.NegativeInfinity, double.PositiveInfinity);
        }

        var bodies = new List<double>();
        for (var u = lowBody; u < highBody; u += BodyGridStep)
        {
            bodies.Add(Math.Exp(u));
        }

        bodies.Add(Math.Exp(highBody));
        var leads = new List<double>();
        for (var u = Math.Log(tauMin); u < highBody - Math.Log(1.5); u += GridStep)
        {
            leads.Add(Math.Exp(u));
        }

        var (meanY, yc, syy) = Centred(y[..n]);
        var body = Columns(t, yc, bodies);
        var lead = Columns(t, yc, leads);
        var points = new List<(double Q, double A, double C, double Body)>();
        for (var l = 0; l < bodies.Count; l++)
        {
            var (cl, gl, hl, ml) = body[l];
            if (!(ml > 0))
            {
                continue;
            }

            var penalty = prior.Penalty(bodies[l]);
            foreach (var (rss, a, c) in BodyProfile(n, meanY, syy, body[l], lead, leads, bodies[l]))
            {
                points.Add(((Math.Max(rss, 0) / s2) + penalty, a, c, bodies[l]));
            }
        }

        if (points.Count == 0)
        {
            return (double.NegativeInfinity, double.PositiveInfinity);
        }

        foreach (var p in points)
        {
            if (p.Q < bestDeviance)
            {
                (bestDeviance, bestFinal, bestBody) = (p.Q, p.A, p.Body);
            }
        }

        var (low, high) = (bestFinal, bestFinal);
        foreach (var (q, a, c, _) in points)
        {
            var room = bestDeviance + threshold - q;
            if (room < 0)
            {
                continue;
            }

            var half = Math.Sqrt(room * c * s2);
            (low, high) = (Math.Min(low, a - half), Math.Max(high, a + half));
        }

        return (low, high);
    }
}
