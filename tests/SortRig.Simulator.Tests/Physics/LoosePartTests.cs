using SortRig.Simulator.Operator;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Physics;

/// <summary>Loose parts (not on the reel) handed in by the virtual operator, e.g. a bridging part.</summary>
public sealed class LoosePartTests
{
    [Fact]
    public void TakeLoosePart_NumberedAfterTheReel_WithinTolerance_TruthKnown()
    {
        var bench = new SimulatedBench(Benches.Manual(Benches.SingleNominal(20_000, count: 5)));

        var first = bench.TakeLoosePart(10_000);
        var second = bench.TakeLoosePart(10_000);

        Assert.Equal((5, 6), (first.Index, second.Index));
        Assert.Equal(10_000, first.NominalOhms);
        // ReelSpec 1 % tolerance, Normal(0.4) never beyond 2.5 sigma here
        Assert.InRange(first.OhmsAt23C, 9_900, 10_100);
        Assert.NotEqual(first.OhmsAt23C, second.OhmsAt23C);
        Assert.Equal(first.OhmsAt23C, bench.Truth(first.Index), 9); // 23 degC ambient, no drift
        Assert.Equal(
            first,
            new SimulatedBench(Benches.Manual(Benches.SingleNominal(20_000, count: 5))).TakeLoosePart(10_000)
        );
    }

    [Fact]
    public async Task HandIn_StopsFeeding_InsertsThePart_TakeOutEmptiesTheFixture()
    {
        var clock = Benches.FakeClock();
        var options = Benches.Manual(Benches.SingleNominal(20_000, count: 5)) with
        {
            Operator = new OperatorOptions { Mode = OperatorMode.Auto, MaxDwell = TimeSpan.FromHours(1) },
        };
        await using var bench = new SimulatedBench(options, clock);
        bench.Operator.Start();
        clock.Advance(TimeSpan.FromSeconds(5)); // the first reel part is in
        await VirtualTime.EventuallyAsync(() => bench.Fixture.IsOccupied, "first reel part inserted");

        var loose = bench.TakeLoosePart(10_000);
        await VirtualTime.RunAsync(clock, HandInAndReturn(bench, loose), TimeSpan.FromMilliseconds(100));

        Assert.Same(loose, bench.Fixture.Occupant);
        Assert.False(bench.Operator.IsRunning);
        clock.Advance(TimeSpan.FromMinutes(2)); // nobody feeds reel parts meanwhile
        Assert.Same(loose, bench.Fixture.Occupant);

        Assert.Same(loose, bench.Operator.TakeOut());
        Assert.False(bench.Fixture.IsOccupied);
        Assert.Equal(OperatorState.Idle, bench.Operator.State);
    }

    private static async Task<bool> HandInAndReturn(SimulatedBench bench, SortRig.Simulator.Physics.SimulatedPart part)
    {
        await bench.Operator.HandInAsync(part, CancellationToken.None);
        return true;
    }
}
