namespace SortRig.Measurement.Uncertainty;

/// <summary>How a component's standard uncertainty was evaluated (JCGM 100:2008 2.3.2, 2.3.3).</summary>
public enum UncertaintyKind
{
    /// <summary>Statistical analysis of a series of observations.</summary>
    TypeA = 0,

    /// <summary>Any other means: specifications, certificates, resolution, experience.</summary>
    TypeB = 1,
}

/// <summary>One line of an uncertainty budget.</summary>
/// <param name="Name">What the component is (e.g. "resolution"). Not empty.</param>
/// <param name="StandardUncertainty">u(x_i) in the unit of the input quantity; finite, &gt;= 0.</param>
/// <param name="Sensitivity">Sensitivity coefficient c_i = ∂f/∂x_i (JCGM 100:2008 5.1.3); default 1.</param>
/// <param name="DegreesOfFreedom">ν_i; &gt; 0; <see cref="double.PositiveInfinity"/> (default) when the
/// input is known exactly enough (JCGM 100:2008 G.4.3).</param>
/// <param name="Kind">Type A or Type B; default Type B.</param>
public sealed record BudgetComponent(
    string Name,
    double StandardUncertainty,
    double Sensitivity = 1.0,
    double DegreesOfFreedom = double.PositiveInfinity,
    UncertaintyKind Kind = UncertaintyKind.TypeB
)
{
    /// <summary>Name of the component; not empty.</summary>
    public string Name { get; init; } =
        string.IsNullOrWhiteSpace(Name)
            ? throw new ArgumentException("A budget component needs a name.", nameof(Name))
            : Name;

    /// <summary>u(x_i), finite and &gt;= 0.</summary>
    public double StandardUncertainty { get; init; } =
        double.IsFinite(StandardUncertainty) && StandardUncertainty >= 0
            ? StandardUncertainty
            : throw new ArgumentOutOfRangeException(
                nameof(StandardUncertainty),
                StandardUncertainty,
                $"Component '{Name}': u must be finite and >= 0."
            );

    /// <summary>c_i, finite.</summary>
    public double Sensitivity { get; init; } =
        double.IsFinite(Sensitivity)
            ? Sensitivity
            : throw new ArgumentOutOfRangeException(
                nameof(Sensitivity),
                Sensitivity,
                $"Component '{Name}': sensitivity must be finite."
            );

    /// <summary>ν_i, &gt; 0 (may be +∞).</summary>
    public double DegreesOfFreedom { get; init; } =
        DegreesOfFreedom > 0
            ? DegreesOfFreedom
            : throw new ArgumentOutOfRangeException(
                nameof(DegreesOfFreedom),
                DegreesOfFreedom,
                $"Component '{Name}': degrees of freedom must be > 0 (or +infinity)."
            );

    /// <summary>Contribution u_i(y) = |c_i| u(x_i) to the output, in the unit of the output (JCGM 100:2008 eq.
    /// 11b).</summary>
    public double Contribution => Math.Abs(Sensitivity) * StandardUncertainty;
}
