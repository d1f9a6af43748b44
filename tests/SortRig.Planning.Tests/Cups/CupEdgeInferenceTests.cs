using FsCheck;
using FsCheck.Fluent;
using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Cups;

namespace SortRig.Planning.Tests.Cups;

public sealed class CupEdgeInferenceTests
{
    [Fact]
    public void Edges_TwelveCupsOfAThousandPpm_SpanSixThousandEitherSide() =>
        // 12 bands of 0.1 % centred on the nominal: -6000 .. +6000 ppm in steps of 1000 (arithmetic).
        Assert.Equal(
            [-6000, -5000, -4000, -3000, -2000, -1000, 0, 1000, 2000, 3000, 4000, 5000, 6000],
            CupEdgeInference.Edges(12, 1000)
        );

    [Fact]
    public void InferCupCount_PartsSortedByTheBandAssigner_RecoversItsCupCount()
    {
        // The referee is the fixed-band assigner itself: parts spread a little wider than its K bands, sorted with K
        // cups.
        Prop.ForAll(Gen.Choose(1, 23).ToArbitrary(), Gen.Choose(0, 100_000).ToArbitrary(), (k, seed) =>
            {
                var rng = new Random(seed);
                var cups = new BandCupAssigner(new BandCupOptions(k, 500, 10_000, 1));
                var parts = Enumerable
                    .Range(1, 200)
                    .Select(n =>
                    {
                        var ohms = 10_000 * (1 + (((rng.NextDouble() * 2) - 1) * 1.2 * k * 250e-6));
                        var cup = cups.Assign(new CupRequest(n, 10_000, new MeasuredValue(ohms, 0, 0))).CupLabel;
                        return (((ohms - 10_000) / 10_000) * 1e6, (string?)cup);
                    })
                    .ToList();
                return CupEdgeInference.InferCupCount(parts, 500) == k;
            })
            .QuickCheckThrowOnFailure();
    }

    [Fact]
    public void InferCupCount_NoSortedPart_IsNull() =>
        Assert.Null(CupEdgeInference.InferCupCount([(12.0, "R"), (5.0, null)], 1000));
}
