namespace SortRig.Measurement.Ranging;

/// <summary>What a batch read by eye needs from the display.</summary>
/// <param name="Nominal">Nominal value in ohms, &gt; 0.</param>
/// <param name="StockTolerance">Stock tolerance as a fraction (0.01 = 1 %), [0, 1).</param>
/// <param name="MatchTolerance">Half-width of the match band as a fraction (0.001 = ±0.1 %), &gt; 0.</param>
/// <param name="Margin">Head room above nominal × (1 + stock tolerance), a fraction. Default 0.02.</param>
public sealed record HandRangeRequest(
    double Nominal,
    double StockTolerance,
    double MatchTolerance,
    double Margin = 0.02
)
{
    /// <summary>The largest value a part of the batch is expected to show, in ohms.</summary>
    public double Highest => Nominal * (1 + StockTolerance) * (1 + Margin);

    internal void Validate()
    {
        if (!(Nominal > 0) || !double.IsFinite(Nominal))
        {
            throw new ArgumentOutOfRangeException(nameof(Nominal), Nominal, "Nominal must be a finite value > 0 ohms.");
        }

        if (StockTolerance is < 0 or >= 1 || MatchTolerance is <= 0 or >= 1 || Margin is < 0 or > 1)
        {
            throw new ArgumentOutOfRangeException(
                nameof(StockTolerance),
                "Tolerances must be fractions: stock [0, 1), match (0, 1), margin [0, 1]."
            );
        }
    }
}
