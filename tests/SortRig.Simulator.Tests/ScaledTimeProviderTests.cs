using Microsoft.Extensions.Time.Testing;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests;

public sealed class ScaledTimeProviderTests
{
    [Fact]
    public void GetUtcNow_InnerAdvancesOneSecond_ScaledAdvancesSpeedSeconds()
    {
        var inner = Benches.FakeClock();
        var scaled = new ScaledTimeProvider(25, inner);
        var before = scaled.GetUtcNow();
        var stamp = scaled.GetTimestamp();

        inner.Advance(TimeSpan.FromSeconds(1));

        Assert.Equal(TimeSpan.FromSeconds(25), scaled.GetUtcNow() - before);
        Assert.Equal(TimeSpan.FromSeconds(25), scaled.GetElapsedTime(stamp));
    }

    [Fact]
    public async Task Delay_TenScaledSeconds_CompletesAfterInnerTenthOfSpeedAndNotBefore()
    {
        var inner = Benches.FakeClock();
        var scaled = new ScaledTimeProvider(100, inner);

        var delay = Task.Delay(TimeSpan.FromSeconds(10), scaled);
        inner.Advance(TimeSpan.FromMilliseconds(99));
        Assert.False(delay.IsCompleted);

        inner.Advance(TimeSpan.FromMilliseconds(1));
        await delay.WaitAsync(TimeSpan.FromSeconds(5));
    }

    [Fact]
    public void Timer_ChangedToNewDueTime_FiresOnScaledSchedule()
    {
        var inner = Benches.FakeClock();
        var scaled = new ScaledTimeProvider(10, inner);
        var fired = 0;
        using var timer = scaled.CreateTimer(_ => fired++, null, Timeout.InfiniteTimeSpan, Timeout.InfiniteTimeSpan);

        timer.Change(TimeSpan.FromSeconds(5), TimeSpan.FromSeconds(5));
        inner.Advance(TimeSpan.FromMilliseconds(499));
        Assert.Equal(0, fired);
        inner.Advance(TimeSpan.FromMilliseconds(1));
        Assert.Equal(1, fired);
        inner.Advance(TimeSpan.FromMilliseconds(500));
        Assert.Equal(2, fired);
    }

    [Fact]
    public void Timer_ShorterThanOneInnerMillisecond_WaitsOneMillisecond()
    {
        // System.Threading.Timer takes whole milliseconds and fires a 0 ms due time at once (from
        // memory, .NET runtime timer behaviour): a 10 ms timer at speed 50 (0.2 ms inner) must not
        // fire before 1 ms of inner time, or a simulated reading would come ~5x too early.
        var inner = Benches.FakeClock();
        var scaled = new ScaledTimeProvider(50, inner);
        var fired = 0;
        using var timer = scaled.CreateTimer(
            _ => fired++,
            null,
            TimeSpan.FromMilliseconds(10),
            Timeout.InfiniteTimeSpan
        );

        inner.Advance(TimeSpan.FromMilliseconds(0.5));
        Assert.Equal(0, fired);
        inner.Advance(TimeSpan.FromMilliseconds(0.5));
        Assert.Equal(1, fired);
    }

    [Fact]
    public async Task CancellationTokenSource_WithScaledTimeout_CancelsOnScaledTime()
    {
        var inner = Benches.FakeClock();
        var scaled = new ScaledTimeProvider(1000, inner);
        using var cts = new CancellationTokenSource(TimeSpan.FromSeconds(60), scaled);

        inner.Advance(TimeSpan.FromMilliseconds(59));
        Assert.False(cts.IsCancellationRequested);
        inner.Advance(TimeSpan.FromMilliseconds(1));
        await VirtualTime.EventuallyAsync(() => cts.IsCancellationRequested, "scaled CTS timeout");
    }

    [Theory]
    [InlineData(0)]
    [InlineData(-1)]
    [InlineData(double.NaN)]
    [InlineData(20_000)]
    public void Constructor_SpeedOutsideRange_ThrowsNamingSpeed(double speed)
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new ScaledTimeProvider(speed));
        Assert.Equal("speed", ex.ParamName);
    }
}
