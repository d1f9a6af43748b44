namespace SortRig.Measurement.Ranging;

/// <summary>What one nominal of a job asks of the meter.</summary>
/// <param name="Nominal">Nominal resistance, ohms; finite, &gt; 0.</param>
/// <param name="StockTolerance">Stock tolerance of the parts as a fraction (0.01 = 1 %); valid [0, 0.5].</param>
/// <param name="MatchTolerance">Half-width of the match band as a fraction of nominal (0.001 = ±0.1 %); valid (0,
/// 0.5].</param>
/// <param name="Nplc">Integration time in power-line cycles; must be one of the meter's NPLC settings.</param>
/// <param name="FourWire">True for a 4-wire (Kelvin) measurement.</param>
/// <param name="Margin">Extra headroom above nominal × (1 + stock tolerance), fraction; default 0.02; valid [0,
/// 1].</param>
public sealed record RangeRequest(
    double Nominal,
    double StockTolerance,
    double MatchTolerance,
    double Nplc,
    bool FourWire,
    double Margin = 0.02
)
{
    /// <summary>Nominal, ohms.</summary>
    public double Nominal { get; init; } =
        double.IsFinite(Nominal) && Nominal > 0
            ? Nominal
            : throw new ArgumentOutOfRangeException(nameof(Nominal), Nominal, "Nominal must be finite and > 0 ohms.");

    /// <summary>Stock tolerance, fraction in [0, 0.5].</summary>
    public double StockTolerance { get; init; } =
        StockTolerance is >= 0 and <= 0.5
            ? StockTolerance
            : throw new ArgumentOutOfRangeException(
                nameof(StockTolerance),
                StockTolerance,
                "StockTolerance must be a fraction in [0, 0.5] (0.01 = 1 %)."
            );

    /// <summary>Match band half-width, fraction in (0, 0.5].</summary>
    public double MatchTolerance { get; init; } =
        MatchTolerance is > 0 and <= 0.5
            ? MatchTolerance
            : throw new ArgumentOutOfRangeException(
                nameof(MatchTolerance),
                MatchTolerance,
                "MatchTolerance must be a fraction in (0, 0.5] (0.001 = 0.1 %)."
            );

    /// <summary>NPLC, &gt; 0.</summary>
    public double Nplc { get; init; } =
        double.IsFinite(Nplc) && Nplc > 0
            ? Nplc
            : throw new ArgumentOutOfRangeException(nameof(Nplc), Nplc, "Nplc must be finite and > 0.");

    /// <summary>Headroom, fraction in [0, 1].</summary>
    public double Margin { get; init; } =
        Margin is >= 0 and <= 1
            ? Margin
            : throw new ArgumentOutOfRangeException(
                nameof(Margin),
                Margin,
                "Margin must be a fraction in [0, 1] (0.02 = 2 %)."
            );

    /// <summary>The largest value the range must read: nominal × (1 + stock tolerance) × (1 + margin), ohms.</summary>
    public double RequiredLimit => Nominal * (1 + StockTolerance) * (1 + Margin);
}
