using SortRig.Measurement.Specs;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Ranging;

/// <summary>
/// Two neighbouring ranges used by one job. Values compared across them carry the inter-range gain
/// uncertainty; measuring one bridging part on both ranges gives a correction factor that removes it.
/// Relative figures are dimensionless (1e-6 = 1 ppm).
/// </summary>
/// <param name="LowRange">The lower range.</param>
/// <param name="HighRange">The higher range.</param>
/// <param name="GainUncertainty">Relative standard uncertainty of the gain ratio of the two ranges from the
/// spec: both % of reading terms as rectangular half-widths, combined: √((g_L² + g_H²)/3).</param>
/// <param name="BridgeNominal">Suggested bridging part: the largest nominal of the job on the low range, ohms.</param>
/// <param name="ExpectedCorrectionUncertainty">Predicted relative standard uncertainty of the correction factor
/// measured on that part: √((u_L/B)² + (u_H/B)²) from the two predicted transfer uncertainties.</param>
/// <param name="AllowedRelative">UncertaintyRatio × the tightest match tolerance on the two ranges.</param>
/// <param name="CoverageFactor">k used for the two verdicts.</param>
public sealed record RangeTransfer(
    RangeSpec LowRange,
    RangeSpec HighRange,
    double GainUncertainty,
    double BridgeNominal,
    double ExpectedCorrectionUncertainty,
    double AllowedRelative,
    double CoverageFactor
)
{
    /// <summary>True when k × GainUncertainty fits the allowed share of the match band without a correction.</summary>
    public bool UncorrectedResolvable => CoverageFactor * GainUncertainty <= AllowedRelative;

    /// <summary>True when k × ExpectedCorrectionUncertainty fits the allowed share of the match band.</summary>
    public bool CorrectedResolvable => CoverageFactor * ExpectedCorrectionUncertainty <= AllowedRelative;

    /// <summary>
    /// The correction factor F = value on low / value on high, to multiply values read on the high range by,
    /// with u_rel(F)² = (u_L/v_L)² + (u_H/v_H)² from the two transfer uncertainties. The caller records it.
    /// </summary>
    /// <param name="valueOnLow">The bridging part accepted on <see cref="LowRange"/>.</param>
    /// <param name="valueOnHigh">The same part accepted on <see cref="HighRange"/>.</param>
    /// <exception cref="ArgumentException">A value is not &gt; 0, or the two differ by more than 1 % (not the same
    /// part).</exception>
    public RangeCorrection Correction(MeasuredValue valueOnLow, MeasuredValue valueOnHigh)
    {
        ArgumentNullException.ThrowIfNull(valueOnLow);
        ArgumentNullException.ThrowIfNull(valueOnHigh);
        if (!(valueOnLow.Value > 0) || !(valueOnHigh.Value > 0))
        {
            throw new ArgumentException(
                $"Bridging values must be > 0 ohms; got {valueOnLow.Value:G9} and {valueOnHigh.Value:G9}."
            );
        }

        var factor = valueOnLow.Value / valueOnHigh.Value;
        if (Math.Abs(factor - 1) > 0.01)
        {
            throw new ArgumentException(
                $"Bridging values {valueOnLow.Value:G9} and {valueOnHigh.Value:G9} ohm differ by more than 1 %; "
                    + "they cannot be one part read on two ranges."
            );
        }

        var low = valueOnLow.TransferUncertainty / valueOnLow.Value;
        var high = valueOnHigh.TransferUncertainty / valueOnHigh.Value;
        return new RangeCorrection(
            factor,
            Math.Sqrt((low * low) + (high * high)),
            LowRange.FullScale,
            HighRange.FullScale
        );
    }

    internal static RangeTransfer Offer(
        RangeSpec low,
        RangeSpec high,
        IReadOnlyList<RangeDecision> decisions,
        RangeRuleOptions options
    )
    {
        var gainLow = low.AccuracyFor(options.GainSpecPeriod).PercentOfReading / 100.0;
        var gainHigh = high.AccuracyFor(options.GainSpecPeriod).PercentOfReading / 100.0;
        var gain = Math.Sqrt(((gainLow * gainLow) + (gainHigh * gainHigh)) / 3.0);

        var bridge = decisions.Where(d => d.Range == low).MaxBy(d => d.Request.Nominal)!;
        var b = bridge.Request.Nominal;
        var uLow = TransferPrediction.Uncertainty(b, low, bridge.Nplc, bridge.Request.FourWire, options) / b;
        var uHigh = TransferPrediction.Uncertainty(b, high, bridge.Nplc, bridge.Request.FourWire, options) / b;
        var tightest = decisions.Where(d => d.Range == low || d.Range == high).Min(d => d.Request.MatchTolerance);
        return new RangeTransfer(
            low,
            high,
            gain,
            b,
            Math.Sqrt((uLow * uLow) + (uHigh * uHigh)),
            options.UncertaintyRatio * tightest,
            options.CoverageFactor
        );
    }
}
