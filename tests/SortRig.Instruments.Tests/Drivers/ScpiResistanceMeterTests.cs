using Microsoft.Extensions.Time.Testing;
using SortRig.Instruments.Drivers;
using SortRig.Instruments.Profiles;
using SortRig.Instruments.Scpi;
using SortRig.Instruments.Tests.Support;
using SortRig.Measurement.Readings;

namespace SortRig.Instruments.Tests.Drivers;

/// <summary>The profile-driven meter driver against a scripted SCPI-99 DMM on a loopback socket.</summary>
public sealed class ScpiResistanceMeterTests
{
    private static readonly CancellationToken s_none = CancellationToken.None;
    private static readonly DateTimeOffset s_start = new(2026, 3, 14, 22, 5, 0, TimeSpan.Zero);

    [Fact]
    public async Task Configure_SendsTemplates_ChecksErrorQueue_ReadsBack()
    {
        var dmm = new ScriptedDmm();
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var meter = await Open(peer, TestProfiles.Simulator());
        await meter.ConfigureAsync(new ResistanceSetup(10_000, 10, FourWire: false), s_none);
        Assert.Equal(
            [
                "CONF:RES 10000",
                "SENS:RES:RANG 10000",
                "SENS:RES:NPLC 10",
                "TRIG:SOUR IMM",
                "SYST:ERR?",
                "SENS:RES:RANG?",
                "SENS:RES:NPLC?",
            ],
            peer.Received
        );
    }

    [Fact]
    public async Task Configure_FourWire_UsesTheFourWireFunction()
    {
        var dmm = new ScriptedDmm();
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var meter = await Open(peer, TestProfiles.Simulator());
        await meter.ConfigureAsync(new ResistanceSetup(100, 0.04, FourWire: true), s_none);
        Assert.Equal(["CONF:FRES 100", "SENS:FRES:RANG 100", "SENS:FRES:NPLC 0.04"], peer.Received.Take(3));
    }

    [Fact]
    public async Task Configure_MeterQueuesError_ThrowsTypedInstrumentError()
    {
        // SCPI-99 vol. 2 ch. 21: -222 "Data out of range" is an execution error.
        var dmm = new ScriptedDmm();
        dmm.Overrides["SENS:RES:NPLC 40"] = () =>
        {
            dmm.QueueError(-222, "Data out of range");
            return PeerAction.Silent;
        };
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var meter = await Open(peer, TestProfiles.Simulator());
        var ex = await Assert.ThrowsAsync<ScpiInstrumentException>(() =>
            meter.ConfigureAsync(new ResistanceSetup(1000, 40, false), s_none)
        );
        Assert.Equal((-222, ScpiErrorClass.Execution), (ex.Code, ex.Class));
        Assert.Contains("SENS:RES:NPLC 40", ex.Command, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Configure_ReadBackDiffers_ThrowsSetupException()
    {
        var dmm = new ScriptedDmm();
        dmm.Overrides["SENS:RES:RANG?"] = () => PeerAction.Reply("+1.00000000E+05");
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var meter = await Open(peer, TestProfiles.Simulator());
        var ex = await Assert.ThrowsAsync<InstrumentSetupException>(() =>
            meter.ConfigureAsync(new ResistanceSetup(1000, 1, false), s_none)
        );
        Assert.Equal(("range", "1000 ohm", "100000 ohm"), (ex.Setting, ex.Expected, ex.Actual));
    }

    [Theory]
    [InlineData(2000, 1, false)] // not a range of the profile
    [InlineData(1000, 5, false)] // not an NPLC setting of the profile
    public async Task Configure_NotInProfile_ThrowsBeforeSendingAnything(double range, double nplc, bool fourWire)
    {
        await using var peer = ScriptedScpiPeer.Start(new ScriptedDmm().Handle);
        await using var meter = await Open(peer, TestProfiles.Simulator());
        await Assert.ThrowsAsync<ArgumentOutOfRangeException>(() =>
            meter.ConfigureAsync(new ResistanceSetup(range, nplc, fourWire), s_none)
        );
        Assert.Empty(peer.Received);
    }

    [Fact]
    public async Task Read_FiniteValue_TimestampedFromInjectedClock_WithRange()
    {
        var dmm = new ScriptedDmm();
        dmm.Readings.Enqueue("+9.99876500E+03");
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        var clock = new FakeTimeProvider(s_start);
        await using var meter = await Open(peer, TestProfiles.Simulator(), clock);
        await meter.ConfigureAsync(new ResistanceSetup(10_000, 1, false), s_none);
        clock.Advance(TimeSpan.FromSeconds(7));
        Assert.Equal(Reading.Finite(9998.765, s_start.AddSeconds(7), 10_000), await meter.ReadAsync(s_none));
    }

    [Fact]
    public async Task Read_ScpiOverflow_ReturnsOverload()
    {
        // SCPI-99 vol. 1 sec. 7.2.1: 9.9E37 reports over range (open input).
        var dmm = new ScriptedDmm();
        dmm.Readings.Enqueue("+9.90000000E+37");
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var meter = await Open(peer, TestProfiles.Simulator());
        await meter.ConfigureAsync(new ResistanceSetup(100, 1, false), s_none);
        var reading = await meter.ReadAsync(s_none);
        Assert.Equal((ReadingKind.Overload, 100.0), (reading.Kind, reading.Range));
    }

    [Fact]
    public async Task Read_ScpiNotANumber_ThrowsResponseException()
    {
        // SCPI-99 vol. 1 sec. 7.2.1: 9.91E37 is not-a-number, not a resistance.
        var dmm = new ScriptedDmm();
        dmm.Readings.Enqueue("9.91E37");
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var meter = await Open(peer, TestProfiles.Simulator());
        await meter.ConfigureAsync(new ResistanceSetup(100, 1, false), s_none);
        var ex = await Assert.ThrowsAsync<ScpiResponseException>(() => meter.ReadAsync(s_none));
        Assert.Equal("READ?", ex.Command);
    }

    [Fact]
    public async Task Read_BeforeConfigure_Refused()
    {
        await using var peer = ScriptedScpiPeer.Start(new ScriptedDmm().Handle);
        await using var meter = await Open(peer, TestProfiles.Simulator());
        await Assert.ThrowsAsync<InvalidOperationException>(() => meter.ReadAsync(s_none));
    }

    [Fact]
    public async Task VerifySetup_MeterResetToDefaults_ReturnsFalse()
    {
        var dmm = new ScriptedDmm();
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var meter = await Open(peer, TestProfiles.Simulator());
        Assert.False(await meter.VerifySetupAsync(s_none)); // nothing configured yet
        await meter.ConfigureAsync(new ResistanceSetup(100_000, 40, false), s_none);
        Assert.True(await meter.VerifySetupAsync(s_none));
        dmm.ResetToDefaults(); // as after a power glitch
        Assert.False(await meter.VerifySetupAsync(s_none));
    }

    [Fact]
    public async Task RangeChange_WaitsSettleTime_InVirtualTime_SameRangeDoesNot()
    {
        await using var peer = ScriptedScpiPeer.Start(new ScriptedDmm().Handle);
        var clock = new FakeTimeProvider(s_start);
        await using var meter = await Open(peer, TestProfiles.Simulator(settleSeconds: 0.5), clock);
        var first = meter.ConfigureAsync(new ResistanceSetup(1000, 1, false), s_none);
        var advanced = TimeSpan.Zero;
        while (!first.IsCompleted && advanced < TimeSpan.FromSeconds(10))
        {
            await Task.Delay(20);
            if (!first.IsCompleted)
            {
                clock.Advance(TimeSpan.FromMilliseconds(50));
                advanced += TimeSpan.FromMilliseconds(50);
            }
        }

        await first;
        Assert.True(
            advanced >= TimeSpan.FromMilliseconds(500),
            $"finished after {advanced.TotalMilliseconds} ms of virtual time"
        );

        // Same range, other NPLC: no settle wait, so it finishes without the clock moving.
        await meter.ConfigureAsync(new ResistanceSetup(1000, 10, false), s_none).WaitAsync(TimeSpan.FromSeconds(5));
    }

    [Fact]
    public async Task ReadChannels_ClosesReadsAndOpensEachChannelInTurn()
    {
        var dmm = new ScriptedDmm();
        foreach (var r in new[] { "+1.00010000E+04", "+9.99950000E+03", "+1.00002000E+04" })
        {
            dmm.Readings.Enqueue(r);
        }

        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var meter = await Open(peer, TestProfiles.Simulator());
        await meter.ConfigureAsync(new ResistanceSetup(10_000, 10, true), s_none);
        var before = peer.Received.Count;
        var readings = await meter.ReadChannelsAsync([101, 102, 105], s_none);
        Assert.Equal([10001.0, 9999.5, 10000.2], readings.Select(r => r.Value));
        Assert.Equal(
            [
                "ROUT:CLOS (@101)",
                "SYST:ERR?",
                "READ?",
                "ROUT:OPEN (@101)",
                "ROUT:CLOS (@102)",
                "SYST:ERR?",
                "READ?",
                "ROUT:OPEN (@102)",
                "ROUT:CLOS (@105)",
                "SYST:ERR?",
                "READ?",
            ],
            peer.Received.Skip(before).Take(11)
        );
    }

    [Fact]
    public async Task ReadChannels_ProfileWithoutScanner_NotSupported()
    {
        await using var peer = ScriptedScpiPeer.Start(new ScriptedDmm().Handle);
        var profile = TestProfiles.Shipped("bench-5half");
        await using var meter = new ScpiResistanceMeter(await peer.ConnectSessionAsync(), profile);
        await meter.ConfigureAsync(new ResistanceSetup(1000, 2, false), s_none).WaitAsync(TimeSpan.FromSeconds(5));
        await Assert.ThrowsAsync<NotSupportedException>(() => meter.ReadChannelsAsync([101], s_none));
    }

    private static async Task<ScpiResistanceMeter> Open(
        ScriptedScpiPeer peer,
        MeterProfile profile,
        TimeProvider? time = null
    ) => new(await peer.ConnectSessionAsync(new ScpiSessionOptions(profile.Comms.QueryTimeout), time), profile, time);
}
