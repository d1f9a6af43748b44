using SortRig.Measurement.Specs;

namespace SortRig.Measurement.Uncertainty;

/// <summary>Which accuracy specification of a range applies: the time since the meter's calibration.</summary>
public enum SpecPeriod
{
    /// <summary>Within 24 hours of calibration, 23 degC ± 1 K.</summary>
    Hours24 = 0,

    /// <summary>Within one year of calibration (the usual case on a bench).</summary>
    Year1 = 1,
}

/// <summary>Picks the accuracy specification of a range for a <see cref="SpecPeriod"/>.</summary>
public static class SpecPeriodExtensions
{
    /// <summary>The range's accuracy for the period.</summary>
    public static AccuracySpec AccuracyFor(this RangeSpec range, SpecPeriod period)
    {
        ArgumentNullException.ThrowIfNull(range);
        return period switch
        {
            SpecPeriod.Hours24 => range.Accuracy24Hours,
            SpecPeriod.Year1 => range.Accuracy1Year,
            _ => throw new ArgumentOutOfRangeException(nameof(period), period, "Spec period must be Hours24 or Year1."),
        };
    }
}
