using SortRig.Simulator.Operator;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Operator;

/// <summary>When the virtual operator starts feeding: at once (Auto) or on the host's cue (OnCue).</summary>
public sealed class OperatorModeTests
{
    private static readonly TimeSpan s_handling = TimeSpan.FromSeconds(2);

    [Fact]
    public async Task Auto_FeedsTheFirstPartOnceServing()
    {
        var clock = Benches.FakeClock();
        await using var bench = new SimulatedBench(Options(OperatorMode.Auto), clock);
        await bench.StartTcpAsync();

        clock.Advance(s_handling);

        await VirtualTime.EventuallyAsync(() => bench.Fixture.Occupant?.Index == 0, "first part");
    }

    [Fact]
    public async Task OnCue_WaitsForStartThenFeedsAsAuto()
    {
        var clock = Benches.FakeClock();
        await using var bench = new SimulatedBench(Options(OperatorMode.OnCue), clock);
        await bench.StartTcpAsync();

        clock.Advance(TimeSpan.FromMinutes(10));
        await Task.Delay(20); // any wrongly started loop would have had its continuations run
        Assert.False(bench.Fixture.IsOccupied);
        Assert.Equal(OperatorState.Idle, bench.Operator.State);

        bench.Operator.Start();
        clock.Advance(s_handling);

        await VirtualTime.EventuallyAsync(() => bench.Fixture.Occupant?.Index == 0, "first part after the cue");
    }

    private static SimulatedBenchOptions Options(OperatorMode mode) =>
        Benches.Manual(Benches.SingleNominal(10_000, count: 3)) with
        {
            Operator = new OperatorOptions
            {
                Mode = mode,
                HandlingTimeMin = s_handling,
                HandlingTimeMax = s_handling,
            },
        };
}
