using Microsoft.Extensions.Time.Testing;
using SortRig.Engine.Simulation;

namespace SortRig.Engine.Tests.Simulation;

/// <summary>
/// The sessions' virtual clock against FakeTimeProvider (Microsoft.Extensions.TimeProvider.Testing) as the referee, and
/// its operator view: the operator acts only while the session waits on the clock.
/// </summary>
public sealed class VirtualClockTests
{
    private static readonly DateTimeOffset s_start = new(2025, 1, 1, 0, 0, 0, TimeSpan.Zero);

    [Fact]
    public async Task DriveAsync_RandomDelaysFromSeveralTasks_FireAtTheSameTimesAsFakeTimeProvider()
    {
        var rng = new Random(4);
        var chains = Enumerable
            .Range(0, 5)
            .Select(_ => Enumerable.Range(0, 20).Select(_ => TimeSpan.FromMilliseconds(rng.Next(1, 5000))).ToArray())
            .ToArray();

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
        var cancelled = clock.CreateTimer(
            _ => fired.Add("cancelled"),
            null,
            TimeSpan.FromSeconds(1),
            Timeout.InfiniteTimeSpan
        );
        cancelled.Dispose();
        using var periodic = clock.CreateTimer(
            _ => fired.Add(clock.GetUtcNow().ToString("ss", System.Globalization.CultureInfo.InvariantCulture)),
            null,
            TimeSpan.FromSeconds(2),
            TimeSpan.FromSeconds(3)
        );

        await clock.DriveAsync(Task.Delay(TimeSpan.FromSeconds(9), clock), null, default);

        Assert.Equal(["02", "05", "08"], fired);
    }

    [Fact]
    public async Task OperatorTimer_WaitsWhileTheSessionIsBusy_ThenFiresInTimeOrderOnceTheSessionWaitsOnTheClock()
    {
        var clock = new VirtualClock(s_start) { OperatorGrace = TimeSpan.FromHours(1) }; // never alone in this test
        var handled = Task.Delay(TimeSpan.FromSeconds(2), clock.OperatorView)
            .ContinueWith(
                _ => clock.GetUtcNow(),
                CancellationToken.None,
                TaskContinuationOptions.ExecuteSynchronously,
                TaskScheduler.Default
            );
        using var stop = new CancellationTokenSource();
        var driving = clock.DriveAsync(handled, null, stop.Token);

        // The session is busy (a reply in flight, no timer of its own): the operator's 2 s do not pass.
        await Task.Delay(TimeSpan.FromMilliseconds(300));
        Assert.False(handled.IsCompleted);
        Assert.Equal(s_start, clock.GetUtcNow());

        // The session waits 5 s on the clock (a reading's aperture): the operator's timer, due first, fires first.
        var aperture = Task.Delay(TimeSpan.FromSeconds(5), clock);
        await driving;
        Assert.Equal(s_start + TimeSpan.FromSeconds(2), await handled);
        await clock.DriveAsync(aperture, null, default);
        Assert.Equal(s_start + TimeSpan.FromSeconds(5), clock.GetUtcNow());
    }

    [Fact]
    public async Task OperatorTimer_Alone_FiresAfterTheGraceWithinReach_NeverBeyond()
    {
        var clock = new VirtualClock(s_start) { OperatorGrace = TimeSpan.FromMilliseconds(50) };

        // The session waits on the operator (a bridging part handed in): after the grace the handling time passes.
        await clock.DriveAsync(Task.Delay(TimeSpan.FromSeconds(3), clock.OperatorView), null, default);
        Assert.Equal(s_start + TimeSpan.FromSeconds(3), clock.GetUtcNow());

        // The operator's patience (an hour) is beyond reach: it never passes on its own.
        var patience = Task.Delay(TimeSpan.FromHours(1), clock.OperatorView);
        using var stop = new CancellationTokenSource(TimeSpan.FromMilliseconds(400));
        await Assert.ThrowsAnyAsync<OperationCanceledException>(() => clock.DriveAsync(patience, null, stop.Token));
        Assert.False(patience.IsCompleted);
        Assert.Equal(s_start + TimeSpan.FromSeconds(3), clock.GetUtcNow());
    }

    [Fact]
    public void MoveTo_FiresTheTimersDueOnTheWayInOrder_AsFakeTimeProviderDoes_AndNeverGoesBack()
    {
        static List<double> Fired(TimeProvider time, Action<TimeSpan> advance)
        {
            var fired = new List<double>();
            var start = time.GetUtcNow();
            double Since() => (time.GetUtcNow() - start).TotalSeconds;
            var (one, two, three) = (TimeSpan.FromSeconds(1), TimeSpan.FromSeconds(2), TimeSpan.FromSeconds(3));
            using var once = time.CreateTimer(_ => fired.Add(Since()), null, three, Timeout.InfiniteTimeSpan);
            using var periodic = time.CreateTimer(_ => fired.Add(-Since()), null, one, two);
            advance(TimeSpan.FromSeconds(6));
            return fired;
        }

        var clock = new VirtualClock(s_start);
        var fake = new FakeTimeProvider(s_start);

        var moved = Fired(clock, d => clock.MoveTo(s_start + d));

        // Referee: FakeTimeProvider advanced a millisecond at a time, so that each timer sees the time it was due at.
        void ByMilliseconds(TimeSpan d)
        {
            for (var ms = 0; ms < d.TotalMilliseconds; ms++)
            {
                fake.Advance(TimeSpan.FromMilliseconds(1));
            }
        }

        Assert.Equal(Fired(fake, ByMilliseconds), moved);
        Assert.Equal([-1, 3, -3, -5], moved);
        Assert.Equal(s_start + TimeSpan.FromSeconds(6), clock.GetUtcNow());
        Assert.Throws<ArgumentOutOfRangeException>(() => clock.MoveTo(s_start));
    }

    private static async Task ChainAsync(
        TimeProvider time,
        int chain,
        TimeSpan[] delays,
        List<(int, DateTimeOffset)> seen
    )
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
