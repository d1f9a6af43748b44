using SortRig.Engine.Sorting;
using SortRig.Simulator;
using SortRig.Simulator.Faults;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Physics;

namespace SortRig.Engine.Simulation;

/// <summary>
/// The demo scenario of our own: a small instrument maker sorting a reel of 1 % 10 kOhm metal-film
/// parts for R-2R DAC ladders. Builds the embedded simulator's options from the sort options.
/// </summary>
public static class DemoBench
{
    /// <summary>Parts on the demo reel when the session does not say.</summary>
    public const int DefaultParts = 60;

    /// <summary>Simulator options for a sorting demo of the given session.</summary>
    public static SimulatedBenchOptions For(SortOptions sort, int parts) =>
        new()
        {
            Seed = sort.Seed,
            TcpPort = 0,
            TimeScale = sort.Speed,
            Reel = new ReelSpec
            {
                Count = parts,
                Nominals = [new NominalShare(sort.Nominal, 1)],
                TolerancePercent = sort.StockTolerance * 100,
                Distribution = ValueDistribution.Normal(0.4),
            },
            Faults = FaultsFor(sort.FaultsPerThousand),
            Physics = new PhysicsSpec { Model = sort.Physics },

            // The virtual operator puts the first part in when the loop says it is ready, as a person would, and
            // leaves each part in until it is announced: a host that stalls (a loaded machine, a slow first
            // reading) must not see a part pulled unmeasured, which would leave the session a part short.
            Operator = new OperatorOptions { Mode = OperatorMode.OnCue, MaxDwell = TimeSpan.FromHours(1) },

            // Each range reads off by its own gain error within ±25 ppm (the simulator profile's 24 h % of reading term
            // on 10 kOhm), so a ratio across two ranges is visibly off until a bridging part corrects it.
            RangeGainErrorPpm = RangeGainErrorPpm,
        };

    /// <summary>Half-width of the demo meter's per-range gain errors, ppm of reading.</summary>
    public const double RangeGainErrorPpm = 25;

    /// <summary>Spreads <see cref="SortOptions.FaultsPerThousand"/> evenly over the six fault kinds.</summary>
    public static FaultOptions FaultsFor(double perThousand)
    {
        var rate = perThousand / 1000 / Enum.GetValues<FaultKind>().Length;
        return new FaultOptions
        {
            DropRate = rate,
            DelayRate = rate,
            GarbleRate = rate,
            SpuriousErrorRate = rate,
            SilentResetRate = rate,
            NotANumberRate = rate,
        };
    }
}
