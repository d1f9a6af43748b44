using System.Globalization;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Meter;

public sealed class ReadingTimeTests
{
    // Our documented timing (docs/simulator.md): NPLC / 50 Hz, doubled with autozero, plus 1 ms overhead.
    [Theory]
    [InlineData(0.4, false)]
    [InlineData(0.04, true)]
    [InlineData(1, true)]
    [InlineData(4, true)]
    [InlineData(10, true)]
    [InlineData(40, true)]
    [InlineData(10, false)]
    public async Task Read_TakesNplcDependentVirtualTime(double nplc, bool autoZero)
    {
        var clock = Benches.FakeClock();
        await using var bench = new SimulatedBench(Benches.Manual(), clock);
        var zero = autoZero ? "ON" : "OFF";
        await bench.ExecuteAsync(string.Create(CultureInfo.InvariantCulture, $"RES:NPLC {nplc};:ZERO:AUTO {zero}"));
        var expected = TimeSpan.FromTicks(
            (long)Math.Round(((nplc / 50 * (autoZero ? 2 : 1)) + 0.001) * TimeSpan.TicksPerSecond)
        );

        var read = bench.ExecuteAsync("READ?");
        clock.Advance(expected - TimeSpan.FromTicks(1));
        await Task.Delay(20);
        Assert.False(read.IsCompleted);

        // The bench clock's timers resolve whole milliseconds: the reply comes at the next whole ms.
        clock.Advance(
            TimeSpan.FromMilliseconds(Math.Ceiling(expected.TotalMilliseconds)) - expected + TimeSpan.FromTicks(1)
        );
        Assert.Equal(Numbers.Overflow, Numbers.Parse((await read.WaitAsync(TimeSpan.FromSeconds(5)))!));
    }

    [Fact]
    public async Task Read_WithSampleCount_TakesThatManyReadingTimes()
    {
        var clock = Benches.FakeClock();
        await using var bench = new SimulatedBench(Benches.Manual(), clock);
        await bench.ExecuteAsync("SAMP:COUN 5");
        var start = clock.GetUtcNow();

        var reply = await VirtualTime.RunAsync(clock, bench.ExecuteAsync("READ?"), TimeSpan.FromMilliseconds(1));

        Assert.Equal(5, Numbers.ParseList(reply!).Length);
        Assert.Equal(5 * 41, (clock.GetUtcNow() - start).TotalMilliseconds, 1.0); // 5 x (1/50 x 2 + 0.001) s
    }
}
