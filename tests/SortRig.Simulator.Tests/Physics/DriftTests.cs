using Microsoft.Extensions.Time.Testing;
using SortRig.Simulator.Physics;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Physics;

public sealed class DriftTests
{
    [Fact]
    public async Task DriftingPart_OnAScannerChannel_ReadsItsLinearDriftOvernight()
    {
        var clock = Benches.FakeClock();
        var reel = Benches.SingleNominal(10_000) with { DriftSigmaPpmPerHour = 5 };
        await using var bench = new SimulatedBench(Benches.Manual(reel), clock);
        var part = bench.Reel.MaxBy(p => Math.Abs(p.DriftPpmPerHour))!;
        bench.Scanner.Load(101, part);
        await bench.ExecuteAsync("CONF:RES 10000;:RES:NPLC 40;:SAMP:COUN 4;:ROUT:CLOS (@101)");
        clock.Advance(TimeSpan.FromSeconds(1));

        var evening = Numbers.ParseList((await PacedAsync(clock, bench.ExecuteAsync("READ?")))!).Average();
        clock.Advance(TimeSpan.FromHours(10));
        var morning = Numbers.ParseList((await PacedAsync(clock, bench.ExecuteAsync("READ?")))!).Average();

        // R(t) = R23 (1 + drift t): 10 h of drift, read at 40 NPLC (step 0.1 ppm, noise 0.15 ppm, 1.601 s a reading) as
        // the mean of 4: sigma sqrt(0.15² + 0.1²/12)/2 = 0.077 ppm, so 0.5 ppm is 4.6 sigma for the difference of two
        // means.
        var driftPpm = ((morning / evening) - 1) * 1e6;
        Assert.Equal(part.DriftPpmPerHour * 10, driftPpm, 0.5);
        Assert.Equal(bench.Truth(part.Index), morning, 10_000 * 0.5e-6);
        Assert.True(Math.Abs(part.DriftPpmPerHour) > 1, "the reel has a part that visibly drifts");
    }

    // Moves the clock in 20 ms steps with a real pause of at least 1 ms each, so that a starved thread pool on a
    // loaded machine cannot let virtual hours pass before the reading is taken (2 s steps with only a yield once
    // let the clock run ahead by about two hours of drift, 25 ppm). At most 20 ms of bench time per real ms.
    private static async Task<string?> PacedAsync(FakeTimeProvider clock, Task<string?> read)
    {
        while (!read.IsCompleted)
        {
            clock.Advance(TimeSpan.FromMilliseconds(20));
            await Task.Delay(1);
        }

        return await read;
    }
}
