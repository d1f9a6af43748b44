using SortRig.Engine.Sorting;
using SortRig.Planning.Cups;

namespace SortRig.Engine.Composition;

/// <summary>Builds the cup assigner a session asks for (Sort:Assigner).</summary>
public static class CupAssignerFactory
{
    /// <summary>bands, adaptive or slots; throws <see cref="ArgumentException"/> naming the option otherwise.</summary>
    public static ICupAssigner Create(SortOptions options) =>
        options.Assigner switch
        {
            AssignerKind.Bands => new BandCupAssigner(
                new BandCupOptions(
                    options.Cups,
                    options.MatchTolerance * 1e6,
                    options.Nominal,
                    options.StockTolerance * 100,
                    options.PartsPerSet
                )
            ),
            AssignerKind.Adaptive => new AdaptiveCupPlanner(
                new AdaptiveCupOptions(
                    options.Cups,
                    options.MatchTolerance * 1e6,
                    options.StockTolerance * 100,
                    new Dictionary<double, int> { [options.Nominal] = options.PartsPerSet }
                )
            ),
            AssignerKind.Slots => new SlotAssigner(new SlotOptions(nominals: [options.Nominal])),
            _ => throw new ArgumentException(
                $"Sort:Assigner '{options.Assigner}' is not bands, adaptive or slots.",
                nameof(options)
            ),
        };
}
