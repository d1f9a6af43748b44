using Microsoft.Extensions.Time.Testing;
using SortRig.Simulator.Operator;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Operator;

/// <summary>The operator's auto loop on a FakeTimeProvider with fixed timings.</summary>
public sealed class VirtualOperatorTests : IAsyncLifetime
{
    private readonly FakeTimeProvider _clock = Benches.FakeClock();
    private SimulatedBench _bench = null!;

    public Task InitializeAsync()
    {
        var options = Benches.Manual(Benches.SingleNominal(10_000, count: 4, tempco: 100)) with
        {
            Operator = new OperatorOptions
            {
                Mode = OperatorMode.Manual,
                HandlingTimeMin = TimeSpan.FromSeconds(2),
                HandlingTimeMax = TimeSpan.FromSeconds(2),
                WarmKelvinMin = 4,
                WarmKelvinMax = 4,
                ReactionTimeMin = TimeSpan.FromSeconds(1),
                ReactionTimeMax = TimeSpan.FromSeconds(1),
                MaxDwell = TimeSpan.FromSeconds(30),
            },
        };
        _bench = new SimulatedBench(options, _clock);
        return Task.CompletedTask;
    }

    public async Task DisposeAsync() => await _bench.DisposeAsync();

    [Fact]
    public async Task Start_HandlesForTheHandlingTimeThenInsertsTheFirstPartWarm()
    {
        _bench.Operator.Start();
        Assert.Equal(OperatorState.Handling, _bench.Operator.State);

        _clock.Advance(TimeSpan.FromSeconds(1.999));
        Assert.False(_bench.Fixture.IsOccupied);
        _clock.Advance(TimeSpan.FromMilliseconds(1));
        await VirtualTime.EventuallyAsync(() => _bench.Operator.State == OperatorState.Inserted, "insert");

        Assert.Equal(0, _bench.Fixture.Occupant!.Index);
        // 4 K warmer at 100 ppm/K: the part reads 400 ppm high right after insertion (by hand).
        await _bench.ExecuteAsync("CONF:RES 10000;:RES:NPLC 1");
        var reply = await VirtualTime.RunAsync(
            _clock,
            _bench.ExecuteAsync("MEAS:RES? 10000"),
            TimeSpan.FromMilliseconds(41)
        );
        Assert.InRange(
            (double.Parse(reply!, System.Globalization.CultureInfo.InvariantCulture) / _bench.Truth(0)) - 1,
            350e-6,
            400e-6
        );
    }

    [Fact]
    public async Task Announce_RemovesThePart_NextOneFollowsAfterReactionAndHandling()
    {
        await InsertFirstAsync();

        Assert.True(_bench.Operator.OnPartAnnounced());
        await VirtualTime.EventuallyAsync(() => _bench.Operator.State == OperatorState.Reacting, "removal");
        Assert.False(_bench.Fixture.IsOccupied);

        _clock.Advance(TimeSpan.FromSeconds(1));
        await VirtualTime.EventuallyAsync(() => _bench.Operator.State == OperatorState.Handling, "handling");
        _clock.Advance(TimeSpan.FromSeconds(2));
        await VirtualTime.EventuallyAsync(() => _bench.Fixture.Occupant?.Index == 1, "second part");
        Assert.Equal(0, _bench.Operator.DwellTimeouts);
    }

    [Fact]
    public async Task NoAnnouncement_PartComesOutAfterMaxDwell()
    {
        await InsertFirstAsync();

        _clock.Advance(TimeSpan.FromSeconds(29.9));
        Assert.True(_bench.Fixture.IsOccupied);
        _clock.Advance(TimeSpan.FromSeconds(0.1));

        await VirtualTime.EventuallyAsync(() => !_bench.Fixture.IsOccupied, "dwell timeout");
        Assert.Equal(1, _bench.Operator.DwellTimeouts);
    }

    [Fact]
    public async Task SkipTo_ResumesTheReelAtThatIndex()
    {
        await InsertFirstAsync();

        _bench.Operator.SkipTo(3);
        await VirtualTime.EventuallyAsync(() => _bench.Operator.State == OperatorState.Handling, "back to handling");
        Assert.False(_bench.Fixture.IsOccupied);
        _clock.Advance(TimeSpan.FromSeconds(2));

        await VirtualTime.EventuallyAsync(() => _bench.Fixture.Occupant?.Index == 3, "part 3");
    }

    [Fact]
    public async Task ReelFinished_FixtureStaysEmpty()
    {
        _bench.Operator.SkipTo(3);
        await InsertFirstAsync(expected: 3);

        _bench.Operator.OnPartAnnounced();
        await VirtualTime.EventuallyAsync(() => _bench.Operator.State == OperatorState.Reacting, "removal");

        // Step the clock until the operator has noticed the empty reel: its reaction timer may be
        // created just after a single Advance on a loaded machine.
        await VirtualTime.EventuallyAsync(
            () =>
            {
                if (_bench.Operator.State != OperatorState.Finished)
                {
                    _clock.Advance(TimeSpan.FromMilliseconds(100));
                }

                return _bench.Operator.State == OperatorState.Finished;
            },
            "finished"
        );
        _clock.Advance(TimeSpan.FromMinutes(5));
        Assert.False(_bench.Fixture.IsOccupied);
        Assert.Equal(4, _bench.Operator.NextIndex);
    }

    [Fact]
    public async Task Announce_WithoutAPartInTheFixture_IsIgnored()
    {
        _bench.Operator.Start();

        Assert.False(_bench.Operator.OnPartAnnounced());
        await Task.CompletedTask;
    }

    private async Task InsertFirstAsync(int expected = 0)
    {
        _bench.Operator.Start();
        _clock.Advance(TimeSpan.FromSeconds(2));
        await VirtualTime.EventuallyAsync(
            () => _bench.Fixture.Occupant?.Index == expected,
            $"part {expected} inserted"
        );
    }
}
