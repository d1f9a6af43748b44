namespace SortRig.Measurement.Settling;

/// <summary>The shape fitted to a part's recovery by the predictive settle rule.</summary>
public enum RecoveryModel
{
    /// <summary>y(t) = A + B e^(−t/τ): one thermal path.</summary>
    OneExponential = 1,

    /// <summary>y(t) = A + B₁ e^(−t/τ₁) + B₂ e^(−t/τ₂): two thermal paths (e.g. body, and leads into the
    /// fixture).</summary>
    TwoExponentials = 2,
}
