namespace SortRig.Measurement.Settling;

/// <summary>Which rule accepted a part.</summary>
public enum SettleRule
{
    /// <summary>The averaging rule: the mean of the last readings once they stopped moving.</summary>
    Averaging = 0,

    /// <summary>The predictive rule: the final value extrapolated from a fit of the recovery.</summary>
    Predictive = 1,
}
