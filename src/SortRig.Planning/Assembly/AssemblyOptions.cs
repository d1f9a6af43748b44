namespace SortRig.Planning.Assembly;

/// <summary>Limits of the set assembler. Validated at construction.</summary>
public sealed record AssemblyOptions
{
    /// <summary>Creates validated options.</summary>
    /// <param name="exactPartLimit">Largest number of usable parts solved exactly; 0 to 64, default 24. Above it the sweep runs.</param>
    /// <param name="exactSetLimit">Largest number of position assignments the exact search enumerates; 1 to 10 000 000, default 300 000.</param>
    /// <param name="exactStateLimit">Largest number of memoised packing states; 1 to 20 000 000, default 2 000 000.</param>
    /// <param name="nominalMatchPpm">How close a part's marked nominal must be to a wanted nominal, ppm; 0 to 100 000, default 100.</param>
    public AssemblyOptions(int exactPartLimit = 24, int exactSetLimit = 300_000, int exactStateLimit = 2_000_000, double nominalMatchPpm = 100)
    {
        ExactPartLimit = exactPartLimit is >= 0 and <= 64 ? exactPartLimit
            : throw new ArgumentOutOfRangeException(nameof(exactPartLimit), exactPartLimit, "ExactPartLimit must be 0 to 64");
        ExactSetLimit = exactSetLimit is >= 1 and <= 10_000_000 ? exactSetLimit
            : throw new ArgumentOutOfRangeException(nameof(exactSetLimit), exactSetLimit, "ExactSetLimit must be 1 to 10 000 000");
        ExactStateLimit = exactStateLimit is >= 1 and <= 20_000_000 ? exactStateLimit
            : throw new ArgumentOutOfRangeException(nameof(exactStateLimit), exactStateLimit, "ExactStateLimit must be 1 to 20 000 000");
        NominalMatchPpm = nominalMatchPpm is >= 0 and <= 100_000 ? nominalMatchPpm
            : throw new ArgumentOutOfRangeException(nameof(nominalMatchPpm), nominalMatchPpm, "NominalMatchPpm must be 0 to 100 000");
    }

    /// <summary>Largest number of usable parts solved exactly (0–64, default 24).</summary>
    public int ExactPartLimit { get; }

    /// <summary>Largest number of assignments enumerated by the exact search (default 300 000).</summary>
    public int ExactSetLimit { get; }

    /// <summary>Largest number of memoised packing states (default 2 000 000).</summary>
    public int ExactStateLimit { get; }

    /// <summary>Nominal match window, ppm (default 100).</summary>
    public double NominalMatchPpm { get; }

    /// <summary>True when a part's marked nominal counts as the wanted one.</summary>
    public bool SameNominal(double partNominal, double wanted) => Math.Abs(partNominal - wanted) <= wanted * NominalMatchPpm * 1e-6;
}
