using SortRig.Measurement.Settling;
using SortRig.Simulator.Physics;

namespace SortRig.Bench.Settling;

/// <summary>
/// The fit information limit: an oracle for rules that fit the recovery, the counterpart of
/// <see cref="InformationLimit"/>. It knows the model's form (one exponential on the simple physics; on the rich one
/// the body and lead paths, both amplitudes and both time constants unknown) and the reading's variance, not the
/// part's parameters; it stops at the first reading n (after the contact bounce) at which the Cramér-Rao bound of the
/// asymptote from readings first..n, at the part's true parameters, satisfies z·sqrt(CRB) ≤ 2 × target, z = 3.29 (0.1 %
/// two-sided, normal). With <c>bodyLogSd</c> finite, the body's ln τ also carries a Gaussian prior of that sd (the
/// reel's spread): the Bayesian information of the population, not a strict bound (docs/bench-settle.md).
/// Reads the part's hidden physics (truth side) and only the reading times, never a reading: the simulator's noise
/// stream, drawn in sequence, is left as the rules drew it.
/// </summary>
internal static class FitLimit
{
    /// <summary>Two-sided 0.1 % point of the standard normal, Φ⁻¹(0.9995) = 3.2905.</summary>
    public const double Z = 3.2905;

    public static RuleOutcome Run(
        Insertion insertion,
        SimulatedPart part,
        double targetPpm,
        double readingSigmaOhms,
        TimeSpan bounce,
        TimeSpan horizon,
        double bodyLogSd = double.PositiveInfinity
    ) => RunUnder(insertion, part, targetPpm, ReadingNoise.White(readingSigmaOhms), bounce, horizon, bodyLogSd);

    /// <summary>
    /// The same oracle under the bench's own reading noise (<paramref name="noise"/>: the meter's white noise plus, on
    /// the rich physics, the part's 1/f-like excess noise, whose covariance the simulator states exactly:
    /// <see cref="AsymptoteBound.Variances"/>), stopping no earlier than the <paramref name="leastReading"/>-th
    /// reading after the bounce. Popcorn and the ambient wander are left out (independent noise added to the
    /// readings, they could only lower the information), so it remains a bound of the same kind.
    /// </summary>
    public static RuleOutcome RunUnder(
        Insertion insertion,
        SimulatedPart part,
        double targetPpm,
        ReadingNoise noise,
        TimeSpan bounce,
        TimeSpan horizon,
        double bodyLogSd = double.PositiveInfinity,
        int leastReading = 1
    )
    {
        var limit = 2 * targetPpm * 1e-6 * insertion.Truth / Z;
        var first = insertion.FirstEndingAtOrAfter(bounce);
        var last = insertion.FirstEndingAtOrAfter(horizon);
        var times = Enumerable.Range(first, last - first + 1).Select(k => insertion.Since(k).TotalSeconds).ToArray();
        var bounds = AsymptoteBound.Variances(times, Paths(insertion, part, bodyLogSd), noise);
        for (var i = Math.Max(leastReading - 1, 0); i < bounds.Length; i++)
        {
            if (bounds[i] <= limit * limit)
            {
                return RuleOutcome.Timed(insertion.Since(first + i).TotalSeconds, first + i + 1);
            }
        }

        return RuleOutcome.Unstable(insertion.Since(last).TotalSeconds, last + 1);
    }

    /// <summary>The bench's reading noise in ohms for a part of value <paramref name="truth"/>: white noise of
    /// <paramref name="readingSigmaOhms"/> and, under rich physics, the excess noise's four components
    /// (<see cref="PhysicsSpec.FlickerTimeConstants"/>, a quarter of <see cref="PhysicsSpec.FlickerPpm"/>'s variance
    /// each).</summary>
    public static ReadingNoise BenchNoise(PhysicsModel physics, double readingSigmaOhms, double truth)
    {
        if (physics != PhysicsModel.Rich)
        {
            return ReadingNoise.White(readingSigmaOhms);
        }

        var spec = new PhysicsSpec { Model = physics };
        var ohms = spec.FlickerPpm * 1e-6 * truth;
        var count = PhysicsSpec.FlickerTimeConstants.Count;
        return new ReadingNoise(
            readingSigmaOhms,
            [.. PhysicsSpec.FlickerTimeConstants.Select(tau => new CorrelatedNoise(ohms * ohms / count, tau))]
        );
    }

    /// <summary>Of two oracles' outcomes for one part, the one that stops first (an unstable one only when both
    /// are).</summary>
    public static RuleOutcome Earlier(RuleOutcome a, RuleOutcome b) =>
        (a.Accepted, b.Accepted) switch
        {
            (true, false) => a,
            (false, true) => b,
            _ => a.Seconds <= b.Seconds ? a : b,
        };

    /// <summary>The part's true paths: amplitude = value × tempco × handling warmth × the path's share (the steady
    /// self-heating, ≤ 0.01 K on the 10 kOhm range, left out: it moves an amplitude by well under 1 %).</summary>
    private static RecoveryPath[] Paths(Insertion insertion, SimulatedPart part, double bodyLogSd)
    {
        var total = insertion.Truth * insertion.TempcoPpmPerKelvin * 1e-6 * insertion.WarmKelvin;
        var body = new RecoveryPath(
            total * (1 - part.LeadShare),
            part.ThermalTimeConstant.TotalSeconds,
            LogTimeConstantSd: bodyLogSd
        );
        return part.LeadShare == 0
            ? [body]
            : [body, new RecoveryPath(total * part.LeadShare, part.LeadTimeConstant.TotalSeconds)];
    }
}
