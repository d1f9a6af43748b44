using Microsoft.Extensions.Time.Testing;
using SortRig.Engine.Simulation;

namespace SortRig.Engine.Tests.Drift;

/// <summary>The drift job's virtual clock against FakeTimeProvider (Microsoft.Extensions.TimeProvider.Testing) as the referee.</summary>
public sealed class VirtualClockTests
{
    private static readonly DateTimeOffset s_start = new(2025, 1, 1, 0, 0, 0, TimeSpan.Zero);

    [Fact]
    public async Task DriveAsync_RandomDelaysFromSeveralTasks_FireAtTheSameTimesAsFakeTimeProvider()
    {
        var rng = new Random(4);
        var chains = Enumerable.Range(0, 5).Select(_ => Enumerable.Range(0, 20).Select(_ => TimeSpan.FromMilliseconds(rng.Next(1, 5000))).ToArray()).ToArray();

        var clock = new VirtualClock(s_start);
        var seen = new List<(int Chain, DateTimeOffset At)>();
        var work = Task.WhenAll(chains.Select((delays, c) => ChainAsync(clock, c, delays, seen)));
        await clock.DriveAsync(work, null, default);

        // Referee: the same chains on FakeTimeProvider, advanced one millisecond at a time.
        var fake = new FakeTimeProvider(s_start);
        var expected = new List<(int Chain, DateTimeOffset At)>();
        var reference = Task.WhenAll(chains.Select((delays, c) => ChainAsync(fake, c, delays, expected)));
        while (!reference.IsCompleted)
        {
            fake.Advance(TimeSpan.FromMilliseconds(1));
        }

        await reference;
        Assert.Equal(expected.OrderBy(e => e.At).ThenBy(e => e.Chain), seen.OrderBy(e => e.At).ThenBy(e => e.Chain));
        Assert.Equal(chains.Max(c => c.Aggregate(TimeSpan.Zero, (a, b) => a + b)), clock.GetUtcNow() - s_start);
    }

    [Fact]
    public async Task DisposedTimer_NeverFires_AndPeriodicTimerRepeats()
    {
        var clock = new VirtualClock(s_start);
        var fired = new List<string>();
        var cancelled = clock.CreateTimer(_ => fired.Add("cancelled"), null, TimeSpan.FromSeconds(1), Timeout.InfiniteTimeSpan);
        cancelled.Dispose();
        using var periodic = clock.CreateTimer(_ => fired.Add(clock.GetUtcNow().ToString("ss", System.Globalization.CultureInfo.InvariantCulture)), null, TimeSpan.FromSeconds(2), TimeSpan.FromSeconds(3));

        await clock.DriveAsync(Task.Delay(TimeSpan.FromSeconds(9), clock), null, default);

        Assert.Equal(["02", "05", "08"], fired);
    }

    private static async Task ChainAsync(TimeProvider time, int chain, TimeSpan[] delays, List<(int, DateTimeOffset)> seen)
    {
        foreach (var d in delays)
        {
            await Task.Delay(d, time);
            lock (seen)
            {
                seen.Add((chain, time.GetUtcNow()));
            }
        }
    }
}
