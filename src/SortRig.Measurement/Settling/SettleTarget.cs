namespace SortRig.Measurement.Settling;

/// <summary>Unit of a <see cref="SettleTarget"/>.</summary>
public enum SettleTargetUnit
{
    /// <summary>Ohms.</summary>
    Ohms = 0,

    /// <summary>Parts per million of the window mean.</summary>
    Ppm = 1,
}

/// <summary>The target standard error of the mean of the settle window, in ohms or in ppm of the value.</summary>
/// <param name="Value">The target; finite, &gt; 0.</param>
/// <param name="Unit">Ohms or ppm.</param>
public readonly record struct SettleTarget(double Value, SettleTargetUnit Unit)
{
    /// <summary>A target in ohms; &gt; 0.</summary>
    public static SettleTarget Ohms(double ohms) => new(Positive(ohms), SettleTargetUnit.Ohms);

    /// <summary>A target in ppm of the value; &gt; 0.</summary>
    public static SettleTarget Ppm(double ppm) => new(Positive(ppm), SettleTargetUnit.Ppm);

    /// <summary>True when the value is finite and &gt; 0.</summary>
    public bool IsValid => double.IsFinite(Value) && Value > 0 && Enum.IsDefined(Unit);

    /// <summary>The target in ohms for a value of the given size (ohms).</summary>
    public double InOhms(double value) => Unit == SettleTargetUnit.Ohms ? Value : Value * 1e-6 * Math.Abs(value);

    private static double Positive(double x) =>
        double.IsFinite(x) && x > 0
            ? x
            : throw new ArgumentOutOfRangeException(nameof(x), x, "A settle target must be finite and > 0.");
}
