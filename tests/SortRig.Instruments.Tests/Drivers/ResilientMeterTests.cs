using Microsoft.Extensions.Time.Testing;
using SortRig.Instruments.Drivers;
using SortRig.Instruments.Profiles;
using SortRig.Instruments.Scpi;
using SortRig.Instruments.Transports;
using SortRig.Measurement.Readings;

namespace SortRig.Instruments.Tests.Drivers;

public sealed class ResilientMeterTests
{
    private static readonly ResistanceSetup s_setup = new(10_000, 1, false);

    [Fact]
    public async Task Get_OpensOnceIdentifiesOnceAndAppliesTheSetupOnEveryConnection()
    {
        var opened = new List<FakeMeter>();
        await using var meter = new ResilientMeter(
            _ => Task.FromResult<IResistanceMeter>(Add(opened, new FakeMeter())),
            s_setup,
            identify: true
        );

        var first = await meter.GetAsync(default);
        Assert.Same(first, await meter.GetAsync(default));
        await meter.DropAsync();
        meter.Setup = s_setup with { Range = 100_000 };
        await meter.GetAsync(default);

        Assert.Equal(2, opened.Count);
        Assert.Equal([s_setup], opened[0].Configured);
        Assert.Equal([s_setup with { Range = 100_000 }], opened[1].Configured);
        Assert.Equal(1, opened[0].Identified + opened[1].Identified);
        Assert.Equal("Invented M1 s/n 7 fw 1.0", meter.Identity);
        Assert.True(opened[0].Disposed);
    }

    [Fact]
    public async Task Get_ConfigureFails_ClosesTheHalfOpenedConnection()
    {
        var broken = new FakeMeter { FailConfigure = new InstrumentLinkException("fake", "connection lost") };
        await using var meter = new ResilientMeter(
            _ => Task.FromResult<IResistanceMeter>(broken),
            s_setup,
            identify: false
        );

        await Assert.ThrowsAsync<InstrumentLinkException>(() => meter.GetAsync(default));
        Assert.True(broken.Disposed);
        Assert.Null(meter.Current);
    }

    [Fact]
    public async Task ConnectWithRetry_FaultsThenSuccess_WaitsDoublingUpToTheLast()
    {
        var time = new FakeTimeProvider();
        var failures = 4;
        var waits = new List<TimeSpan>();
        await using var meter = new ResilientMeter(
            _ =>
                failures-- > 0
                    ? throw new InstrumentLinkException("fake", "refused")
                    : Task.FromResult<IResistanceMeter>(new FakeMeter()),
            s_setup,
            identify: false
        );

        var connecting = meter.ConnectWithRetryAsync(
            new Backoff(TimeSpan.FromSeconds(1), TimeSpan.FromSeconds(3)),
            time,
            (_, wait, _) =>
            {
                waits.Add(wait);
                return ValueTask.CompletedTask;
            },
            default
        );
        while (!connecting.IsCompleted)
        {
            time.Advance(TimeSpan.FromSeconds(1));
            await Task.Yield();
        }

        await connecting;
        // Doubling back-off capped at the last wait (arithmetic: 1, 2, 4 -> 3, 3).
        Assert.Equal(
            [TimeSpan.FromSeconds(1), TimeSpan.FromSeconds(2), TimeSpan.FromSeconds(3), TimeSpan.FromSeconds(3)],
            waits
        );
    }

    [Fact]
    public async Task ConnectWithRetry_SetupKeepsReadingBackWrong_GivesUpAfterTheRetries()
    {
        var time = new FakeTimeProvider();
        var attempts = 0;
        await using var meter = new ResilientMeter(
            _ =>
            {
                attempts++;
                return Task.FromResult<IResistanceMeter>(
                    new FakeMeter { FailConfigure = new InstrumentSetupException("range", "10000", "100") }
                );
            },
            s_setup,
            identify: false
        );

        var connecting = meter.ConnectWithRetryAsync(
            new Backoff(TimeSpan.FromSeconds(1), TimeSpan.FromSeconds(1)),
            time,
            (_, _, _) => ValueTask.CompletedTask,
            default
        );
        while (!connecting.IsCompleted)
        {
            time.Advance(TimeSpan.FromSeconds(1));
            await Task.Yield();
        }

        await Assert.ThrowsAsync<InstrumentSetupException>(() => connecting);
        Assert.Equal(MeterFaults.SetupRetries + 1, attempts);
    }

    [Fact]
    public async Task ConnectWithRetry_NeverReached_StopsAfterTheFirstConnectAttempts_NamingWhatWasTried()
    {
        var time = new FakeTimeProvider();
        var attempts = 0;
        await using var meter = new ResilientMeter(
            _ =>
            {
                attempts++;
                throw new InstrumentLinkException(
                    "tcp://127.0.0.1:9",
                    "could not connect: Connection refused",
                    null,
                    openFailed: true
                );
            },
            s_setup,
            identify: false
        );

        var connecting = meter.ConnectWithRetryAsync(
            new Backoff(TimeSpan.FromSeconds(0.25), TimeSpan.FromSeconds(5)),
            time,
            (_, _, _) => ValueTask.CompletedTask,
            default
        );
        while (!connecting.IsCompleted)
        {
            time.Advance(TimeSpan.FromSeconds(0.25));
            await Task.Yield();
        }

        var e = await Assert.ThrowsAsync<MeterUnreachableException>(() => connecting);
        Assert.Equal(MeterFaults.FirstConnectAttempts, attempts);
        Assert.Equal("tcp://127.0.0.1:9", e.Endpoint);
        // Waits 0.25 + 0.5 + 1 s between the four attempts (arithmetic).
        Assert.Contains(
            "Connection refused (4 attempts over 1.75 s); check that it is switched on",
            e.Message,
            StringComparison.Ordinal
        );
        Assert.False(meter.HasConnected);
    }

    [Fact]
    public async Task ConnectWithRetry_ReachedOnceThenLost_RetriedPastTheFirstConnectLimit()
    {
        var time = new FakeTimeProvider();
        var refusals = 0;
        await using var meter = new ResilientMeter(
            _ =>
                refusals is > 0 and <= 10
                    ? throw new InstrumentLinkException(
                        "tcp://127.0.0.1:9",
                        "could not connect: Connection refused",
                        null,
                        openFailed: (refusals++ > 0)
                    )
                    : Task.FromResult<IResistanceMeter>(new FakeMeter()),
            s_setup,
            identify: false
        );
        await meter.GetAsync(default);
        await meter.DropAsync();
        refusals = 1; // the meter is switched off after it was reached: ten refusals, then it is back

        var connecting = meter.ConnectWithRetryAsync(
            new Backoff(TimeSpan.FromSeconds(1), TimeSpan.FromSeconds(1)),
            time,
            (_, _, _) => ValueTask.CompletedTask,
            default
        );
        while (!connecting.IsCompleted)
        {
            time.Advance(TimeSpan.FromSeconds(1));
            await Task.Yield();
        }

        await connecting;
        Assert.True(meter.HasConnected);
        Assert.Equal(11, refusals);
    }

    private static FakeMeter Add(List<FakeMeter> list, FakeMeter meter)
    {
        list.Add(meter);
        return meter;
    }

    private sealed class FakeMeter : IResistanceMeter
    {
        public List<ResistanceSetup> Configured { get; } = [];

        public int Identified { get; private set; }

        public bool Disposed { get; private set; }

        public Exception? FailConfigure { get; init; }

        public MeterProfile Profile => throw new NotSupportedException();

        public Task<InstrumentIdentity> IdentifyAsync(CancellationToken ct)
        {
            Identified++;
            return Task.FromResult(new InstrumentIdentity("Invented", "M1", "7", "1.0"));
        }

        public Task ConfigureAsync(ResistanceSetup setup, CancellationToken ct)
        {
            Configured.Add(setup);
            return FailConfigure is { } e ? Task.FromException(e) : Task.CompletedTask;
        }

        public Task<Reading> ReadAsync(CancellationToken ct) => throw new NotSupportedException();

        public Task<IReadOnlyList<Reading>> ReadChannelsAsync(IReadOnlyList<int> channels, CancellationToken ct) =>
            throw new NotSupportedException();

        public Task<bool> VerifySetupAsync(CancellationToken ct) => Task.FromResult(true);

        public ValueTask DisposeAsync()
        {
            Disposed = true;
            return ValueTask.CompletedTask;
        }
    }
}
