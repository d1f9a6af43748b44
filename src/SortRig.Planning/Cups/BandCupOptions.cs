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
        CupCount = CupOptionRules.CupCount(cupCount);
        MatchTolerancePpm = CupOptionRules.MatchTolerancePpm(matchTolerancePpm);
        Nominal =
            nominal > 0 && double.IsFinite(nominal)
                ? nominal
                : throw new ArgumentOutOfRangeException(
                    nameof(nominal),
                    nominal,
                    "Nominal must be a finite resistance > 0 ohms"
                );
        StockTolerancePercent = CupOptionRules.StockTolerancePercent(stockTolerancePercent);
        PartsPerSet = partsPerSet is >= 1 and <= 100
            ? partsPerSet
            : throw new ArgumentOutOfRangeException(nameof(partsPerSet), partsPerSet, "PartsPerSet must be 1 to 100");
        UncertaintyLimitPpm = CupOptionRules.UncertaintyLimitPpm(uncertaintyLimitPpm, matchTolerancePpm);
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
