namespace SortRig.Planning.Cups;

/// <summary>Options of <see cref="BandCupAssigner"/>: fixed bands centred on the nominal. Validated at
/// construction.</summary>
public sealed record BandCupOptions
{
    /// <summary>Creates validated options.</summary>
    /// <param name="cupCount">Regular cups K, 1 to 23 (a reject cup "R" comes on top).</param>
    /// <param name="matchTolerancePpm">Band width, ppm of nominal, 1 to 100 000.</param>
    /// <param name="nominal">Nominal of the reel, ohms, &gt; 0.</param>
    /// <param name="stockTolerancePercent">Marked tolerance of the reel, percent, 0.001 to 50; parts outside are
    /// rejected.</param>
    /// <param name="partsPerSet">Parts of this nominal in one set, 1 to 100, default 4.</param>
    /// <param name="uncertaintyLimitPpm">Largest expanded transfer uncertainty accepted, ppm; 0 to 100 000, default
    /// half the band width.</param>
    public BandCupOptions(
        int cupCount,
        double matchTolerancePpm,
        double nominal,
        double stockTolerancePercent,
        int partsPerSet = 4,
        double? uncertaintyLimitPpm = null
    )
    {
        CupCount = cupCount is >= 1 and <= CupLabels.MaxCups
            ? cupCount
            : throw new ArgumentOutOfRangeException(
                nameof(cupCount),
                cupCount,
                $"CupCount must be 1 to {CupLabels.MaxCups}"
            );
        MatchTolerancePpm = matchTolerancePpm is >= 1 and <= 100_000
            ? matchTolerancePpm
            : throw new ArgumentOutOfRangeException(
                nameof(matchTolerancePpm),
                matchTolerancePpm,
                "MatchTolerancePpm must be 1 to 100 000"
            );
        Nominal =
            nominal > 0 && double.IsFinite(nominal)
                ? nominal
                : throw new ArgumentOutOfRangeException(
                    nameof(nominal),
                    nominal,
                    "Nominal must be a finite resistance > 0 ohms"
                );
        StockTolerancePercent = stockTolerancePercent is >= 0.001 and <= 50
            ? stockTolerancePercent
            : throw new ArgumentOutOfRangeException(
                nameof(stockTolerancePercent),
                stockTolerancePercent,
                "StockTolerancePercent must be 0.001 to 50"
            );
        PartsPerSet = partsPerSet is >= 1 and <= 100
            ? partsPerSet
            : throw new ArgumentOutOfRangeException(nameof(partsPerSet), partsPerSet, "PartsPerSet must be 1 to 100");
        UncertaintyLimitPpm = uncertaintyLimitPpm ?? (matchTolerancePpm / 2);
        if (UncertaintyLimitPpm is < 0 or > 100_000)
        {
            throw new ArgumentOutOfRangeException(
                nameof(uncertaintyLimitPpm),
                uncertaintyLimitPpm,
                "UncertaintyLimitPpm must be 0 to 100 000"
            );
        }
    }

    /// <summary>Regular cups K (1–23).</summary>
    public int CupCount { get; }

    /// <summary>Band width, ppm of nominal.</summary>
    public double MatchTolerancePpm { get; }

    /// <summary>Reel nominal, ohms.</summary>
    public double Nominal { get; }

    /// <summary>Reel tolerance, percent.</summary>
    public double StockTolerancePercent { get; }

    /// <summary>Parts of this nominal per set.</summary>
    public int PartsPerSet { get; }

    /// <summary>Largest expanded transfer uncertainty accepted, ppm of nominal.</summary>
    public double UncertaintyLimitPpm { get; }
}
