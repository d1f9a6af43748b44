namespace SortRig.Planning.Assembly;

/// <summary>Limits of the set assembler. Validated at construction.</summary>
public sealed record AssemblyOptions
{
    /// <summary>Creates validated options.</summary>
    /// <param name="exactPartLimit">Largest number of usable parts solved exactly; 0 to 64, default 24. Above it the
    /// sweep runs.</param>
    /// <param name="exactSetLimit">Largest number of position assignments the exact search enumerates; 1 to 10 000 000,
    /// default 300 000.</param>
    /// <param name="exactStateLimit">Largest number of memoised packing states; 1 to 20 000 000, default 2 000
    /// 000.</param>
    /// <param name="nominalMatchPpm">How close a part's marked nominal must be to a wanted nominal, ppm; 0 to 100 000,
    /// default 100.</param>
    /// <param name="timeLimit">Wall time for the neighbourhood search after the sweep; 0 to 1 hour, default 10 s. The
    /// best plan so far is returned with its bound when it runs out.</param>
    /// <param name="neighbourhoodParts">Parts re-packed exactly per neighbourhood; 0 (no neighbourhood search) to 40,
    /// default 20.</param>
    /// <param name="progress">Receives progress after the sweep and after each neighbourhood pass; null for
    /// none.</param>
    public AssemblyOptions(
        int exactPartLimit = 24,
        int exactSetLimit = 300_000,
        int exactStateLimit = 2_000_000,
        double nominalMatchPpm = 100,
        TimeSpan? timeLimit = null,
        int neighbourhoodParts = 20,
        IProgress<AssemblyProgress>? progress = null
    )
    {
        TimeLimit = timeLimit ?? TimeSpan.FromSeconds(10);
        if (TimeLimit < TimeSpan.Zero || TimeLimit > TimeSpan.FromHours(1))
        {
            throw new ArgumentOutOfRangeException(nameof(timeLimit), timeLimit, "TimeLimit must be 0 to 1 hour");
        }

        NeighbourhoodParts = neighbourhoodParts is >= 0 and <= 40
            ? neighbourhoodParts
            : throw new ArgumentOutOfRangeException(
                nameof(neighbourhoodParts),
                neighbourhoodParts,
                "NeighbourhoodParts must be 0 to 40"
            );
        Progress = progress;
        ExactPartLimit = exactPartLimit is >= 0 and <= 64
            ? exactPartLimit
            : throw new ArgumentOutOfRangeException(
                nameof(exactPartLimit),
                exactPartLimit,
                "ExactPartLimit must be 0 to 64"
            );
        ExactSetLimit = exactSetLimit is >= 1 and <= 10_000_000
            ? exactSetLimit
            : throw new ArgumentOutOfRangeException(
                nameof(exactSetLimit),
                exactSetLimit,
                "ExactSetLimit must be 1 to 10 000 000"
            );
        ExactStateLimit = exactStateLimit is >= 1 and <= 20_000_000
            ? exactStateLimit
            : throw new ArgumentOutOfRangeException(
                nameof(exactStateLimit),
                exactStateLimit,
                "ExactStateLimit must be 1 to 20 000 000"
            );
        NominalMatchPpm = nominalMatchPpm is >= 0 and <= 100_000
            ? nominalMatchPpm
            : throw new ArgumentOutOfRangeException(
                nameof(nominalMatchPpm),
                nominalMatchPpm,
                "NominalMatchPpm must be 0 to 100 000"
            );
    }

    /// <summary>Largest number of usable parts solved exactly (0–64, default 24).</summary>
    public int ExactPartLimit { get; }

    /// <summary>Largest number of assignments enumerated by the exact search (default 300 000).</summary>
    public int ExactSetLimit { get; }

    /// <summary>Largest number of memoised packing states (default 2 000 000).</summary>
    public int ExactStateLimit { get; }

    /// <summary>Nominal match window, ppm (default 100).</summary>
    public double NominalMatchPpm { get; }

    /// <summary>Wall time of the neighbourhood search (default 10 s, 0 to 1 hour).</summary>
    public TimeSpan TimeLimit { get; }

    /// <summary>Parts per exactly re-packed neighbourhood (0–40, default 20; 0 turns the neighbourhood search
    /// off).</summary>
    public int NeighbourhoodParts { get; }

    /// <summary>Progress receiver, or null.</summary>
    public IProgress<AssemblyProgress>? Progress { get; }

    /// <summary>True when a part's marked nominal counts as the wanted one.</summary>
    public bool SameNominal(double partNominal, double wanted) =>
        Math.Abs(partNominal - wanted) <= wanted * NominalMatchPpm * 1e-6;
}
