using System.Globalization;
using SortRig.Measurement.Ranging;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Specs;

namespace SortRig.Engine.Sorting;

/// <summary>
/// The measurement plan of a batch, fixed before the first part: the locked range and NPLC from
/// the range rule, and the settle rule's options derived from the match tolerance.
/// </summary>
/// <param name="Options">The session's settings.</param>
/// <param name="Decision">The range rule's decision (range locked for the whole batch).</param>
/// <param name="Settle">Settle rule options.</param>
/// <param name="Meter">The meter family's metrology.</param>
public sealed record SortPlan(SortOptions Options, RangeDecision Decision, SettleOptions Settle, MeterSpec Meter)
{
    /// <summary>Full scale of the locked range, ohms.</summary>
    public double Range => Decision.Range.FullScale;

    /// <summary>Integration time, power-line cycles.</summary>
    public double Nplc => Decision.Nplc.Nplc;

    /// <summary>
    /// Chooses the range and settle options for a session on a meter; throws
    /// <see cref="SortPlanException"/> naming remedies when the match tolerance cannot be resolved,
    /// or when no settle target both small against the match band and reachable on that range exists.
    /// </summary>
    public static SortPlan For(SortOptions options, MeterSpec meter)
    {
        var request = new RangeRequest(
            options.Nominal,
            options.StockTolerance,
            options.MatchTolerance,
            options.Nplc,
            options.FourWire
        );
        RangeDecision decision;
        try
        {
            decision = RangeRule.Choose(meter, request);
        }
        catch (ArgumentException e)
        {
            // The reason without .NET's "(Parameter 'nplc')" tail: the operator typed a flag, not a parameter.
            var reason = e.ParamName is { } name
                ? e.Message.Replace($" (Parameter '{name}')", "", StringComparison.Ordinal)
                : e.Message;
            throw new SortPlanException($"The meter '{meter.Family}' cannot take this batch: {reason}", []);
        }

        if (decision.Verdict == RangeVerdict.Refused)
        {
            var remedies = decision.Remedies.Where(r => r.Resolves).Select(Describe).ToList();
            throw new SortPlanException(
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"A {options.MatchTolerance * 100:0.####} % match at {options.Nominal:G6} Ohm needs an expanded "
                        + $"transfer uncertainty of at most {decision.AllowedExpanded:G3} Ohm; the "
                        + $"{decision.Range.FullScale:G6} Ohm range at {options.Nplc:G} NPLC gives "
                        + $"{decision.ExpandedTransfer:G3} Ohm."
                ),
                remedies
            );
        }

        var settle = SettleOptions.Default with
        {
            FourWire = options.FourWire,
            // A part warmed a few kelvin by the fingers cools with a time constant of seconds
            // (common practice, no source): allow about eight time constants before "unstable".
            MaxSettleTime = TimeSpan.FromSeconds(40),
            // Judge the slope over the last 4 s, not over a 0.3 s window that cannot see a cooling
            // curve of seconds (docs/bench-settle.md: no false accepts at 1.2x the information limit).
            SettlingSpan = TimeSpan.FromSeconds(4),
            // By default the predictive rule runs beside the averaging rule (docs/measurement.md, "Predictive rule");
            // --settle averaging leaves it out.
            Predictive = options.Settle == SettleRule.Predictive ? Predictive(options.Parts) : null,
        };

        // The settle target: small against the match band, yet reachable on this range and NPLC
        // (SettleTargetRule; docs/measurement.md, "Settle target").
        var rule = SettleTargetRule.For(decision, settle);
        if (!rule.Reachable)
        {
            var window = rule.WindowFits
                ? ""
                : string.Create(
                    CultureInfo.InvariantCulture,
                    $", and {settle.RequiredReadings} readings take more than half of the "
                        + $"{settle.MaxSettleTime.TotalSeconds:G} s settle time"
                );
            throw new SortPlanException(
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"A {options.MatchTolerance * 100:0.####} % match at {options.Nominal:G6} Ohm allows a settle "
                        + $"target of at most {rule.CapPpm:0.##} ppm; on the {decision.Range.FullScale:G6} Ohm range "
                        + $"at {options.Nplc:G} NPLC the reading noise lets a settled part reach "
                        + $"{rule.FloorPpm:0.##} ppm, and the target must be {SettleTargetRule.ReachMargin:G} "
                        + $"times that ({SettleTargetRule.ReachMargin * rule.FloorPpm:0.##} ppm){window}: "
                        + $"parts would end unstable."
                ),
                SettleTargetRule.Remedies(meter, decision, settle, rule)
            );
        }

        settle = settle with { Target = SettleTarget.Ppm(rule.TargetPpm) };
        return new SortPlan(options, decision, settle, meter);
    }

    private static string Describe(Remedy r) =>
        r.Kind switch
        {
            RemedyKind.RaiseNplc => string.Create(
                CultureInfo.InvariantCulture,
                $"raise the integration time to {r.Setting:G} NPLC (--nplc {r.Setting:G})"
            ),
            RemedyKind.UseFourWire => "measure 4-wire (--four-wire) with a Kelvin fixture",
            RemedyKind.UseRange => string.Create(CultureInfo.InvariantCulture, $"use the {r.Setting:G6} Ohm range"),
            RemedyKind.LoosenMatch => string.Create(
                CultureInfo.InvariantCulture,
                $"loosen the match to {r.Setting * 100:0.####} % (--match {r.Setting:G4})"
            ),
            _ => r.Kind.ToString(),
        };

    /// <summary>
    /// The settle options of a part settled on a tracker of its own (the check standard, a part measured again, a
    /// bridging part): the batch's, without the hold that teaches the reel's prior, since that tracker teaches no reel.
    /// </summary>
    public SettleOptions SettleOnePart =>
        Settle.Predictive is { } predictive
            ? Settle with
            {
                Predictive = predictive with { TeachingFailures = 0 },
            }
            : Settle;

    /// <summary>The least session, in parts, for which the predictive rule holds its first parts to teach the
    /// reel.</summary>
    public const int TeachingLeastParts = 400;

    /// <summary>
    /// The predictive rule's options for a session of <paramref name="parts"/> (0: until the operator finishes, a
    /// reel of unknown length): the first parts are held to teach the reel's prior only when the session is long
    /// enough for the hold to pay (PredictiveOptions.TeachingFailures): 20-35 held parts cost a few seconds each,
    /// paid back at a few tenths of a second on each later part.
    /// </summary>
    private static PredictiveOptions Predictive(int parts) =>
        PredictiveOptions.Default with
        {
            TeachingFailures = parts is > 0 and < TeachingLeastParts ? 0 : PredictiveOptions.ReelTeachingFailures,
        };
}
