namespace SortRig.Measurement.Settling;

/// <summary>
/// The asymptote under a body time constant known to a range (the reel-learned prior, <see cref="ReelPrior"/>):
/// y(t) = A + B_lead e^(−t/τ_lead) + B_body e^(−t/τ_body), τ_body held in [bodyLow, bodyHigh], τ_lead free below
/// τ_body / 1.5, amplitudes of one sign (both paths carry the same handling warmth; B_lead = 0 allowed). At given time
/// constants the model is linear, so the profile of A is exact over a grid of (τ_lead, τ_body) as in
/// <see cref="ProfileInterval"/> (Bates and Watts 1988 sec. 3.5.5, from memory): the union of
/// Â(τ) ± √((threshold − RSS(τ)) c(τ)) over every grid pair whose residual sum lies within the threshold of the least.
/// With τ_body known to a narrow range the asymptote is nearly a linear least-squares problem in the amplitudes and the
/// offset, far better conditioned than with τ_body free.
/// </summary>
internal static partial class ExponentialFitter
{
    /// <summary>Grid step of the body time constant within the prior's range, in ln τ: 2 % steps, fine against the
    /// range (a reel's spread of tens of per cent).</summary>
    private const double BodyGridStep = 0.02;

    /// <summary>
    /// Bodies up to <paramref name="heldHigh"/> (the learned range's ceiling) are held: the best fit's asymptote at
    /// each is inside the interval whatever its residual sum.
    /// The least residual sum under the prior (<paramref name="bestRss"/>, at asymptote <paramref name="bestFinal"/>
    /// and body <paramref name="bestBody"/>) and the profile interval of A at <paramref name="s2"/> (lowest,
    /// highest); infinite when the record cannot bound A.
    /// </summary>
    public static (double Low, double High) PriorInterval(
        ReadOnlySpan<double> t,
        ReadOnlySpan<double> y,
        double s2,
        double tauMin,
        double bodyLow,
        double bodyHigh,
        double heldHigh,
        out double bestRss,
        out double bestFinal,
        out double bestBody,
        double looks = DefaultLooks
    )
    {
        var n = t.Length;
        var bodies = new List<double>();
        for (var u = Math.Log(bodyLow); u < Math.Log(bodyHigh); u += BodyGridStep)
        {
            bodies.Add(Math.Exp(u));
        }

        bodies.Add(bodyHigh);
        var leads = new List<double>();
        for (var u = Math.Log(tauMin); u < Math.Log(bodyHigh / 1.5); u += GridStep)
        {
            leads.Add(Math.Exp(u));
        }

        var (meanY, yc, syy) = Centred(y[..n]);

        var body = Columns(t, yc, bodies);
        var lead = Columns(t, yc, leads);
        var points = new List<(double Rss, double A, double C, double Body)>();
        var held = new List<double>();
        for (var l = 0; l < bodies.Count; l++)
        {
            var first = points.Count;
            var (cl, gl, hl, ml) = body[l];
            if (!(ml > 0))
            {
                continue;
            }

            foreach (var (rss, a, c) in BodyProfile(n, meanY, syy, body[l], lead, leads, bodies[l]))
            {
                points.Add((rss, a, c, bodies[l]));
            }

            if (bodies[l] <= heldHigh * (1 + 1e-9) && points.Count > first)
            {
                // The best fit with the body held here: its asymptote must lie inside the interval whatever the
                // likelihood says, as the record does not tell where in the learned range this part's body lies.
                var bestHere = points.Skip(first).MinBy(p => p.Rss);
                held.Add(bestHere.A);
            }
        }

        (bestRss, bestFinal, bestBody) = (double.PositiveInfinity, double.NaN, double.NaN);
        foreach (var p in points)
        {
            if (p.Rss < bestRss)
            {
                (bestRss, bestFinal, bestBody) = (Math.Max(p.Rss, 0), p.A, p.Body);
            }
        }

        if (points.Count == 0)
        {
            return (double.NegativeInfinity, double.PositiveInfinity);
        }

        var threshold = bestRss + (Threshold(n - 5, looks) * s2);
        var (low, high) = (bestFinal, bestFinal);
        foreach (var a in held)
        {
            (low, high) = (Math.Min(low, a), Math.Max(high, a));
        }

        foreach (var (rss, a, c, _) in points)
        {
            var room = threshold - Math.Max(rss, 0);
            if (room < 0)
            {
                continue;
            }

            var half = Math.Sqrt(room * c);
            (low, high) = (Math.Min(low, a - half), Math.Max(high, a + half));
        }

        return (low, high);
    }
}
