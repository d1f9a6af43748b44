using SortRig.Measurement.Readings;

namespace SortRig.Measurement.Settling;

/// <summary>
/// The predictive rule's state for one insertion: the finite readings since the bounce (or the last flicker) within
/// the fit span, fitted every <see cref="PredictiveOptions.FitInterval"/> with one and with two exponentials, time
/// constants bounded by the assumed longest one. The predicted final value is the mean weighted by AICc (Akaike
/// weights, Burnham and Anderson 2002, from memory). Its fit uncertainty is the wider side of the union, over both
/// models, of the profile-likelihood interval (see <see cref="ExponentialFitter.ProfileInterval"/>) and the
/// linearised interval, over 1.96, with s² inflated by (1 + ρ)/(1 − ρ) for a lag-one residual correlation ρ &gt; 0
/// (the AR(1) effective-sample-size factor, common practice, no source) or by the batch-means factor of quarter-second
/// blocks (<see cref="BatchMeans"/>), whichever is larger: the part's 1/f-like noise hides from lag one under the
/// meter's white noise but not from blocks. When the chosen fit's body is faster than the body prior's floor, the
/// interval also holds the asymptotes of the body held across the prior's range (<see cref="SlowBodyRange"/>). The
/// model-misfit term is a rectangular allowance of MisfitFraction times the recovery still to come. A fit accepts only
/// when its residuals pass the runs test, no level shift is significant (<see cref="StepTest"/>), and the combined
/// uncertainty meets the target. The interval is taken under a range of the body time constant
/// (<see cref="ExponentialFitter.PriorInterval"/>) unless the record refuses it: the reel-learned range
/// (<see cref="BodyRange"/>, <see cref="ReelPrior"/>), or before the reel has taught one the sort's own, from the body
/// prior's floor to the assumed longest time constant; a refused look, or one that would decide under the wide prior
/// with the body fitted below the floor, does not accept. Once the reel has taught its distribution of the body
/// (<see cref="BodyPrior"/>, <see cref="ReelPrior.Body"/>) that distribution takes the range's place in the interval,
/// as a penalty on ln τ_body in the profile likelihood (<see cref="ExponentialFitter.PenalizedInterval"/>).
/// </summary>
internal sealed class PredictiveSettling(PredictiveOptions options, double resolutionOhms, TimeSpan longestTimeConstant)
{
    private const double MinTimeConstantSeconds = 0.02;

    /// <summary>
    /// Block length of the batch-means check, s: a quarter of a second is shorter than the fastest path a fit must
    /// resolve (a lead path of about half a second and up) and long enough that the meter's white noise averages down
    /// in a block at a fast reading rate, so a wander of the part's own noise over the seconds the extrapolation leans
    /// on stands out, while a record of a few seconds still holds a dozen blocks.
    /// </summary>
    private const double BlockSeconds = 0.25;

    /// <summary>
    /// Fraction of <see cref="SettleOptions.AssumedTimeConstant"/> below which a fitted body (slowest) path is not
    /// believed without more record: the assumed constant is the sort's statement of how slowly a handled part of the
    /// reel's package cools, and a part of the same package and mounting is taken to cool no more than twice as fast
    /// (body time constant scales with mass over surface; within one package that varies far less than 2:1; common
    /// practice, no source).
    /// </summary>
    private const double BodyPriorFraction = 0.5;

    /// <summary>
    /// A record resolves the body when it covers this many assumed longest time constants: over shorter records the
    /// fitted body comes out biased fast on the rich bench (settle-diag seed 4030: 1.4-2.6 s against 3.2-4.6 s at
    /// 4.5-6.5 s of record, within a few per cent from 9 s on), as the lead path and the part's slow noise trade
    /// against it; two time constants show the body's curvature (e^−2 of it left) (common practice, no source).
    /// </summary>
    private const double ResolvingSpans = 2;

    /// <summary>Largest relative standard error of a body estimate the reel prior learns: its margin adds twice the
    /// largest error, so 5 % errors lower the floor by a tenth, not more (common practice, no source).</summary>
    private const double ResolvedFraction = 0.05;

    /// <summary>
    /// Least record, s, before the floor may narrow the interval: the span over which the blocking check of
    /// <see cref="BlockSeconds"/> blocks can judge the slow noise of a two-exponential fit (five parameters plus four
    /// blocks). A shorter record under the floor could be accepted on a popcorn level or a 1/f wander the check never
    /// saw (settle-diag seed 4030: a part accepted at 1.4 s, 11 ppm off, on a popcorn level).
    /// </summary>
    private const double PriorMinSpan = (5 + 4) * BlockSeconds;

    /// <summary>χ²₁ at 5 %: the level at which a part's record refuses the reel-learned body range.</summary>
    private const double RefusalChiSquare = 3.841;

    private readonly List<Reading> _readings = [];
    private readonly double _floor = resolutionOhms * resolutionOhms / 12;
    private DateTimeOffset? _lastFit;
    private bool _refused;

    /// <summary>The reel-learned range of the body time constant (<see cref="ReelPrior.BodyRange"/>) for this part,
    /// s; null: none learned yet (the sort's own range, the body prior's floor to the assumed longest time constant,
    /// stands in).</summary>
    public (double Floor, double Ceiling)? BodyRange { get; set; }

    /// <summary>The reel-learned distribution of the body time constant (<see cref="ReelPrior.Body"/>); when set it
    /// takes the place of <see cref="BodyRange"/> in the interval (a penalty on ln τ_body, see
    /// <see cref="ExponentialFitter.PenalizedInterval"/>), and the range's floor is kept for the refusals.</summary>
    public BodyPrior? BodyPrior { get; set; }

    /// <summary>The latest fit made (accepted or not); null before the first.</summary>
    public RecoveryFit? Latest { get; private set; }

    public void Add(Reading reading)
    {
        _readings.Add(reading);
        var drop = 0;
        while (drop < _readings.Count - 1 && reading.Time - _readings[drop].Time > options.FitSpan)
        {
            drop++;
        }

        if (drop > 0)
        {
            _readings.RemoveRange(0, drop);
        }
    }

    public void Clear()
    {
        _readings.Clear();
        _lastFit = null;
        Latest = null;
    }

    /// <summary>
    /// The reel still needs teaching (<see cref="PredictiveOptions.TeachingFailures"/>): no acceptance by prediction
    /// before the record covers <see cref="ResolvingSpans"/> assumed longest time constants, the record on which a
    /// part's body resolves and the reel's prior learns it. The averaging rule may still accept meanwhile.
    /// </summary>
    public bool Teaching { get; set; }

    /// <summary>Fits when one is due; returns the fit when it accepts the part at the target, else null.</summary>
    public RecoveryFit? TryAccept(SettleTarget target)
    {
        if (_readings.Count < options.MinReadings)
        {
            return null;
        }

        var newest = _readings[^1].Time;
        if (
            newest - _readings[0].Time < options.MinSpan
            || (_lastFit is { } last && newest - last < options.FitInterval)
        )
        {
            return null;
        }

        _lastFit = newest;
        if (Fit(out var white) is not { } fit)
        {
            return null;
        }

        Latest = fit;
        if (Teaching && fit.SpanSeconds < ResolvingSpans * longestTimeConstant.TotalSeconds)
        {
            return null; // held: a record that resolves the body teaches the reel's prior (ReelPrior)
        }

        return white && !_refused && fit.StandardUncertainty <= target.InOhms(fit.FinalValue) ? fit : null;
    }

    /// <summary>
    /// The body prior: when the chosen fit's slowest time constant is below <see cref="BodyPriorFraction"/> of the
    /// assumed longest (the floor), the lowest and highest of the final values of the best two-exponential fits with
    /// the slow path held at each of five steps from the floor up to the longest (fast τ on a log grid from 0.05 s up
    /// to the floor, best by residual sum at each step). A fitted body below the floor says that the record has not
    /// separated the body from the lead path (or that the part's own noise bent it): the prior then bounds the body to
    /// [floor, longest] and the record does not say where in that range it lies, so every step's asymptote must lie
    /// inside the rule's interval. (The fifth pass took only the best held fit, which sits at the floor whenever the
    /// record pulls the body faster; its asymptote then still fell short of a body near the longest: settle-diag seed
    /// 4030, fitted 1.9-2.5 s against bodies of 3.2-4.7 s, 10-23 ppm short.) Null when the chosen fit's slow path
    /// already is that slow.
    /// </summary>
    internal static (double Low, double High)? SlowBodyRange(double[] t, double[] y, ExponentialFit best, double maxTau)
    {
        var floor = BodyPriorFraction * maxTau;
        if (best.TimeConstants.Max() >= floor)
        {
            return null;
        }

        var (low, high) = (double.PositiveInfinity, double.NegativeInfinity);
        for (var step = 0; step <= 4; step++)
        {
            var slow = floor + ((maxTau - floor) * step / 4);
            var (bestRss, final) = (double.PositiveInfinity, double.NaN);
            for (var fast = 0.05; fast < floor; fast *= 1.5)
            {
                var rss = ExponentialFitter.Project(t, y, [fast, slow], out var beta);
                if (rss < bestRss)
                {
                    (bestRss, final) = (rss, beta[0]);
                }
            }

            if (double.IsFinite(final))
            {
                (low, high) = (Math.Min(low, final), Math.Max(high, final));
            }
        }

        return double.IsFinite(low) ? (low, high) : null;
    }

    /// <summary>The interval of the final value under the wide prior (time constants anywhere up to the assumed
    /// longest, the body prior's floor).</summary>
    private (double Low, double High) WideInterval(
        double[] t,
        double[] y,
        ExponentialFit one,
        ExponentialFit? two,
        ExponentialFit best,
        double final,
        double inflation,
        double maxTau,
        double looks
    )
    {
        var (low, high) = (final, final);
        // The two-exponential profile is always taken, even when that fit failed: a short record cannot refuse a
        // second, slower path, and one exponential is the special case B₂ = 0 of two.
        var twoProfile =
            two is { } fitted && double.IsFinite(fitted.Rss)
                ? fitted
                : one with
                {
                    Model = RecoveryModel.TwoExponentials,
                };
        foreach (var c in new[] { one, twoProfile })
        {
            if (!double.IsFinite(c.Rss))
            {
                continue;
            }

            var s2 = Math.Max(c.Count > c.Parameters ? c.Rss / (c.Count - c.Parameters) : 0, _floor) * inflation;
            var (pl, ph) = ExponentialFitter.ProfileInterval(t, y, c, s2, MinTimeConstantSeconds, maxTau, looks: looks);
            var quantile = ExponentialFitter.Threshold(c.Count - c.Parameters, looks);
            var linear = c.Converged ? Math.Sqrt(quantile * c.VarianceOfFinal * inflation) : 0;
            (low, high) = (
                Math.Min(low, Math.Min(pl, c.Final - linear)),
                Math.Max(high, Math.Max(ph, c.Final + linear))
            );
        }

        if (SlowBodyRange(t, y, best, maxTau) is { } body)
        {
            (low, high) = (Math.Min(low, body.Low), Math.Max(high, body.High));
        }

        return (low, high);
    }

    /// <summary>Time constants the step alternative tries: around the fitted ones, and the assumed longest.</summary>
    private static IEnumerable<double[]> StepCandidates(ExponentialFit one, ExponentialFit? two, double maxTau)
    {
        foreach (var f in new[] { 0.5, 1, 2 })
        {
            yield return [Math.Min(maxTau, one.TimeConstants[0] * f)];
        }

        yield return [maxTau];
        if (two is { } fit && double.IsFinite(fit.Rss))
        {
            yield return fit.TimeConstants;
            yield return [fit.TimeConstants[0], maxTau];
            yield return [Math.Min(fit.TimeConstants[1], maxTau / 1.5), maxTau];
        }
    }

    /// <summary>
    /// The batch-means inflation of the residuals (see <see cref="BatchMeans"/>) over blocks of
    /// <see cref="BlockSeconds"/>, at least two readings; 1 when the record holds too few blocks to judge.
    /// </summary>
    internal static double SlowNoiseInflation(double[] residuals, double span, int parameters)
    {
        var n = residuals.Length;
        var period = span / Math.Max(1, n - 1);
        var block = Math.Max(2, (int)Math.Round(BlockSeconds / period));
        var s2 = n > parameters ? residuals.Sum(r => r * r) / (n - parameters) : 0;
        var factor = 1.0;
        // The blocking analysis proper (Flyvbjerg and Petersen 1989, from memory): the block length doubles for as
        // long as enough blocks remain, and the largest factor read is taken, since a 1/f-like noise keeps growing
        // with the block (its power rises towards the seconds the extrapolation leans on) instead of levelling off.
        for (; n / block >= parameters + 4; block *= 2)
        {
            var f = BatchMeans.Inflation(residuals, block, parameters, s2);
            factor = double.IsFinite(f) ? Math.Max(factor, f) : factor;
        }

        return factor;
    }

    /// <summary>The model-weighed fit of the readings held, or null when no model converges.</summary>
    internal RecoveryFit? Fit(out bool white)
    {
        white = false;
        _refused = false;
        var n = _readings.Count;
        var t0 = _readings[0].Time;
        var maxTau = longestTimeConstant.TotalSeconds;
        var reference = _readings[^1].Value;
        var t = new double[n];
        var y = new double[n];
        for (var i = 0; i < n; i++)
        {
            t[i] = (_readings[i].Time - t0).TotalSeconds;
            y[i] = _readings[i].Value - reference;
        }

        var one = ExponentialFitter.One(t, y, MinTimeConstantSeconds, maxTau, _floor);
        var two = n >= 10 ? ExponentialFitter.Two(t, y, MinTimeConstantSeconds, maxTau, _floor) : null;
        var candidates = new List<ExponentialFit>();
        if (one.Converged)
        {
            candidates.Add(one);
        }

        if (two is { Converged: true })
        {
            candidates.Add(two);
        }

        if (candidates.Count == 0)
        {
            return null;
        }

        var minAicc = candidates.Min(c => c.Aicc);
        var raw = candidates.Select(c => Math.Exp(-(c.Aicc - minAicc) / 2)).ToArray();
        var weights = raw.Select(w => w / raw.Sum()).ToArray();
        var bestIndex = Array.IndexOf(weights, weights.Max());
        var best = candidates[bestIndex];

        var residuals = new double[n];
        double sumSquares = 0,
            lagProducts = 0;
        for (var i = 0; i < n; i++)
        {
            residuals[i] = y[i] - best.At(t[i]);
            sumSquares += residuals[i] * residuals[i];
            if (i > 0)
            {
                lagProducts += residuals[i] * residuals[i - 1];
            }
        }

        var rho = sumSquares > 0 ? Math.Clamp(lagProducts / sumSquares, 0, 0.95) : 0;
        var lagOne = (1 + rho) / (1 - rho);
        var inflation = Math.Max(lagOne, SlowNoiseInflation(residuals, t[^1], best.Parameters));
        var final = candidates.Select((c, i) => weights[i] * c.Final).Sum();

        // The interval of the final value: the union, over both models (whether or not the data favour the second
        // exponential: a slower path may hide in a short record), of the profile-likelihood interval and the
        // linearised ±z u, at the Bonferroni-corrected level for the rule's repeated looks; s² inflated for correlated
        // residuals. Its larger side over 1.96 is the fit's standard uncertainty, so that U = 2u still covers 95 %
        // over all the looks; it covers the spread between the models too.
        var s2Best = Math.Max(n > best.Parameters ? best.Rss / (n - best.Parameters) : 0, _floor) * inflation;
        double? usedPrior = null;
        // The Bonferroni count of the interval's level: the looks the rule takes in one assumed longest time constant,
        // a look per FitInterval or per reading, whichever is the slower. 20 at NPLC 1 (a look every 0.25 s), as
        // before; at NPLC 10 (a reading every 0.4 s) 12.5, where a count of 20 spread the 5 % over looks the rule
        // never takes: on a non-benchmark seed (settle-diag 300, simple normal NPLC 10, seed 5127) it accepted after
        // 6 looks on average, 5 median, 13 at the 95th percentile. A part still waiting after one time constant gets
        // more looks than the count, but successive looks share all but one reading, so the union bound over them is
        // conservative (Bonferroni is exact only for disjoint failures).
        var lookPeriod = Math.Max(options.FitInterval.TotalSeconds, t[^1] / (n - 1));
        var looks = lookPeriod > 0 ? maxTau / lookPeriod : ExponentialFitter.DefaultLooks;
        var (low, high) = WideInterval(t, y, one, two, best, final, inflation, maxTau, looks);
        // Before the reel has taught its range, the sort's own statement stands in for it: the body lies between
        // BodyPriorFraction of the assumed longest time constant and that constant (the range the wide prior's held
        // fits already span when a fitted body falls below it). Without it a two-path record whose body is fitted
        // above that floor but short of the truth decides on its free profile (settle-seeds, tenth pass: 7 of the 12
        // misses in 64 000 parts, all in the learning phase, two-path fits with the body at 1.5-3.1 s).
        var (floor, ceiling) = BodyRange ?? (BodyPriorFraction * maxTau, maxTau);
        if (BodyPrior is { } learned && t[^1] >= PriorMinSpan)
        {
            // Once the reel has taught it, the body's distribution enters as prior information that adds to the
            // record's: a penalty on ln τ_body in the profile likelihood, not an envelope over the whole range.
            var (pl, ph) = ExponentialFitter.PenalizedInterval(
                t,
                y,
                s2Best,
                MinTimeConstantSeconds,
                maxTau,
                learned,
                RefusalChiSquare,
                out var deviance,
                out var priorFinal,
                out _,
                looks
            );
            // Prior-data conflict (Box 1980, from memory): the least penalised deviance exceeds the free fit's
            // RSS / s² by about χ²₁ when the part is of the reel's kind; beyond its 5 % point the part's record refuses
            // the reel's distribution, as the likelihood-ratio test refuses a range.
            if (
                double.IsFinite(pl)
                && double.IsFinite(ph)
                && deviance - (candidates.Min(c => c.Rss) / s2Best) <= RefusalChiSquare
            )
            {
                // As under a range: a one-path fit keeps the record's own interval when that is the narrower.
                if (
                    best.Model == RecoveryModel.TwoExponentials
                    || best.TimeConstants[0] < floor
                    || Math.Max(priorFinal - pl, ph - priorFinal) < Math.Max(final - low, high - final)
                )
                {
                    (final, low, high, usedPrior) = (priorFinal, pl, ph, floor);
                }
            }
            else
            {
                _refused = true;
            }
        }
        else if (floor > MinTimeConstantSeconds && floor < maxTau && t[^1] >= PriorMinSpan)
        {
            var (pl, ph) = ExponentialFitter.PriorInterval(
                t,
                y,
                s2Best,
                MinTimeConstantSeconds,
                floor,
                maxTau,
                Math.Min(ceiling, maxTau),
                out var priorRss,
                out var priorFinal,
                out _,
                looks
            );
            // The part's record may refuse the reel's range (a part of another package, a drift of the fixture): the
            // likelihood-ratio test of the range against the free fit, χ²₁ at 5 % on each look (no Bonferroni: a
            // refusal only costs time, a missed one may cost a false accept).
            if (
                double.IsFinite(pl)
                && double.IsFinite(ph)
                && priorRss - candidates.Min(c => c.Rss) <= RefusalChiSquare * s2Best
            )
            {
                // Under the range the held fits span all of it, because a two-path record trades body against lead.
                // When the data favour one path there is nothing to trade and the record's own (wide-prior) interval
                // may be the narrower: then it is kept (the simple bench at NPLC 10 lost 0.07 × the limit when the
                // range always decided). A two-path fit always takes the range (the wide prior's misses are two-path
                // fits with the body fitted too fast: settle-diag seed 4030, part 2 031, 2.75 s against 4.54 s).
                if (
                    best.Model == RecoveryModel.TwoExponentials
                    || best.TimeConstants[0] < floor
                    || Math.Max(priorFinal - pl, ph - priorFinal) < Math.Max(final - low, high - final)
                )
                {
                    (final, low, high, usedPrior) = (priorFinal, pl, ph, floor);
                }
            }
            else
            {
                // A part the reel's range does not describe is not accepted by prediction at all on this look: the
                // wide prior's own misses are parts of just this kind (a fitted body far faster than the reel's), so
                // the averaging rule or a later look decides.
                _refused = true;
            }
        }

        if (usedPrior is null && best.TimeConstants.Max() < floor)
        {
            // The reel (or, before it has taught its range, the sort's own floor) says bodies are no faster than the
            // floor, and the record's own fit, about to decide under the wide prior, says this one is: either the part
            // is not of the reel's kind or the record has not separated body from lead (the wide prior's misses:
            // settle-diag seed 4030, bodies fitted 1.2-2.5 s against 3.6-4.5 s at 2-4 s of record). No acceptance by
            // prediction on this look.
            _refused = true;
        }

        var fitUncertainty = Math.Max(final - low, high - final) / 1.959963984540054;
        var toCome = Math.Abs(best.At(t[^1]) - (usedPrior is null ? best.Final : final));
        var allowance = options.MisfitFraction * toCome / Math.Sqrt(3);
        var z = RunsTest.Z(residuals);
        white =
            RunsTest.LooksWhite(residuals, options.WhitenessAlpha)
            && !StepTest.Significant(
                t,
                y,
                StepCandidates(one, two, maxTau),
                candidates.Min(c => c.Rss),
                _floor,
                lagOne, // the step model explains a step that the batch means would read as wander
                options.WhitenessAlpha
            );
        return new RecoveryFit(
            best.Model,
            final + reference,
            fitUncertainty,
            allowance,
            [.. best.TimeConstants.Order()],
            n,
            t[^1],
            Math.Sqrt(sumSquares / n),
            z,
            weights[bestIndex]
        )
        {
            BodyTimeConstant = best.TimeConstants.Max(),
            BodyStandardError = Math.Sqrt(best.VarianceOfSlowest * inflation),
            BodyResolved =
                white
                && t[^1] >= ResolvingSpans * maxTau
                && best.TimeConstants.Max() < maxTau
                && best.VarianceOfSlowest * inflation <= Math.Pow(ResolvedFraction * best.TimeConstants.Max(), 2),
            BodyFloor = usedPrior,
        };
    }
}
