using Microsoft.Extensions.Logging;
using SortRig.Instruments.Scpi;
using SortRig.Instruments.Tests.Support;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Tests.Scpi;

/// <summary>The SCPI session against a scripted SCPI device on a real loopback socket.</summary>
public sealed class ScpiSessionTests
{
    private static readonly CancellationToken s_none = CancellationToken.None;

    [Fact]
    public async Task Query_ReturnsReply_AndLogsTheExchangeAtDebug()
    {
        var dmm = new ScriptedDmm();
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        var logger = new ListLogger();
        await using var session = new ScpiSession(await peer.ConnectLinkAsync(), null, null, logger);
        Assert.Equal(dmm.Identity, await session.QueryAsync("*IDN?", s_none));
        var entry = Assert.Single(logger.Entries);
        Assert.Equal(LogLevel.Debug, entry.Level);
        Assert.Contains("*IDN?", entry.Text, StringComparison.Ordinal);
        Assert.Contains("SIM-6H", entry.Text, StringComparison.Ordinal);
    }

    [Fact]
    public async Task QueryNumber_GarbledReply_ThrowsResponseExceptionNamingCommandAndReply_SessionStaysUsable()
    {
        var dmm = new ScriptedDmm();
        dmm.Overrides["READ?"] = () => PeerAction.Reply("+1.0001#@E+0");
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var session = await peer.ConnectSessionAsync();
        var ex = await Assert.ThrowsAsync<ScpiResponseException>(() => session.QueryNumberAsync("READ?", s_none));
        Assert.Equal(("READ?", "+1.0001#@E+0"), (ex.Command, ex.Reply));
        Assert.False(session.IsBroken);
        Assert.Equal(1000.0, (await session.QueryNumberAsync("SENS:RES:RANG?", s_none)).Value);
    }

    [Fact]
    public async Task Query_DeviceSilent_ThrowsTimeoutCarryingCommandAndTimeout_ThenSessionBroken()
    {
        var dmm = new ScriptedDmm();
        dmm.Overrides["FETC?"] = () => PeerAction.Silent;
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var session = await peer.ConnectSessionAsync();
        var timeout = TimeSpan.FromMilliseconds(200);
        var ex = await Assert.ThrowsAsync<InstrumentTimeoutException>(() =>
            session.QueryAsync("FETC?", timeout, s_none)
        );
        Assert.Equal(("FETC?", timeout), (ex.Command, ex.Timeout));
        Assert.True(session.IsBroken);
        await Assert.ThrowsAsync<InstrumentLinkException>(() => session.QueryAsync("*IDN?", s_none));
    }

    [Fact]
    public async Task Query_ConnectionDropped_ThrowsLinkException_SessionBroken()
    {
        var dmm = new ScriptedDmm();
        dmm.Overrides["READ?"] = () => PeerAction.Drop;
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var session = await peer.ConnectSessionAsync();
        await Assert.ThrowsAsync<InstrumentLinkException>(() => session.QueryAsync("READ?", s_none));
        Assert.True(session.IsBroken);
        await Assert.ThrowsAsync<InstrumentLinkException>(() => session.WriteAsync("*CLS", s_none));
    }

    [Fact]
    public async Task CheckErrors_DrainsQueue_ThrowsTypedFirstErrorWithCommandGroup()
    {
        // SCPI-99 vol. 2 ch. 21: -222 is an execution error, -113 a command error; the queue is read until 0,"No
        // error".
        var dmm = new ScriptedDmm();
        dmm.QueueError(-222, "Data out of range");
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var session = await peer.ConnectSessionAsync();
        await session.WriteAsync("SENS:RES:RANG 10000", s_none);
        await session.WriteAsync("SENS:RES:BOGUS 7", s_none); // the scripted meter queues -113 for it
        var ex = await Assert.ThrowsAsync<ScpiInstrumentException>(() => session.CheckErrorsAsync(s_none));
        Assert.Equal((-222, "Data out of range", ScpiErrorClass.Execution), (ex.Code, ex.InstrumentMessage, ex.Class));
        Assert.Equal("SENS:RES:RANG 10000; SENS:RES:BOGUS 7", ex.Command);
        Assert.Equal([-222, -113], ex.Errors.Select(e => e.Code));
        Assert.Equal(ScpiErrorClass.Command, ex.Errors[1].Class);
        Assert.Equal(3, peer.Received.Count(c => c == "SYST:ERR?"));
        await session.CheckErrorsAsync(s_none); // queue now empty: no throw
    }

    [Fact]
    public async Task CheckErrors_QueueNeverEmpties_StopsAtTheCap()
    {
        var dmm = new ScriptedDmm();
        dmm.Overrides["SYST:ERR?"] = () => PeerAction.Reply("-350,\"Queue overflow\"");
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var session = await peer.ConnectSessionAsync(
            new ScpiSessionOptions(TimeSpan.FromSeconds(2), maxErrorQueueReads: 5)
        );
        var ex = await Assert.ThrowsAsync<ScpiInstrumentException>(() => session.CheckErrorsAsync(s_none));
        Assert.Equal(ScpiErrorClass.DeviceSpecific, ex.Class);
        Assert.Equal(5, ex.Errors.Count);
        Assert.Equal(5, peer.Received.Count(c => c == "SYST:ERR?"));
    }

    [Fact]
    public async Task ScriptedPeer_BackToBackQueriesOnBareLink_AreSeenAsOverlap()
    {
        // Checks the interleaving detector used below: without serialisation it must fire.
        await using var peer = ScriptedScpiPeer.Start(c => PeerAction.Reply("R" + c, delayMs: 30));
        await using var link = await peer.ConnectLinkAsync();
        await link.WriteLineAsync("Q1?", s_none);
        await link.WriteLineAsync("Q2?", s_none);
        Assert.Equal("RQ1?", await link.ReadLineAsync(TimeSpan.FromSeconds(2), s_none));
        Assert.Equal("RQ2?", await link.ReadLineAsync(TimeSpan.FromSeconds(2), s_none));
        Assert.True(peer.Overlaps >= 1);
    }

    [Fact]
    public async Task ConcurrentQueries_AreSerialised_EachCallerGetsItsOwnReply()
    {
        await using var peer = ScriptedScpiPeer.Start(c => PeerAction.Reply("R" + c, delayMs: 3));
        await using var session = await peer.ConnectSessionAsync();
        async Task<bool> Caller(string name)
        {
            var ok = true;
            for (var i = 0; i < 15; i++)
            {
                ok &= await session.QueryAsync($"{name}{i}?", s_none) == $"R{name}{i}?";
            }

            return ok;
        }

        var results = await Task.WhenAll(
            Task.Run(() => Caller("A")),
            Task.Run(() => Caller("B")),
            Task.Run(() => Caller("C"))
        );
        Assert.All(results, Assert.True);
        Assert.Equal(45, peer.Received.Count);
        Assert.Equal(0, peer.Overlaps);
    }

    [Fact]
    public async Task CallerCancelsQuery_LateReplyIsDropped_NextQueryGetsItsOwnReply()
    {
        var dmm = new ScriptedDmm();
        dmm.Overrides["READ?"] = () => PeerAction.Reply("+1.2E+03", delayMs: 300);
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var session = await peer.ConnectSessionAsync();
        using var cts = new CancellationTokenSource(TimeSpan.FromMilliseconds(50));
        await Assert.ThrowsAnyAsync<OperationCanceledException>(() => session.QueryAsync("READ?", cts.Token));
        Assert.False(session.IsBroken);
        Assert.Equal(dmm.Identity, await session.QueryAsync("*IDN?", s_none));
    }

    [Fact]
    public async Task CommonCommands_IdentityEsrOpcAndReset()
    {
        // IEEE 488.2 sec. 11.5.1: ESR bit 5 (32) command error, bit 2 (4) query error; *OPC? answers 1 (sec. 10.19)
        var dmm = new ScriptedDmm();
        dmm.Overrides["*ESR?"] = () => PeerAction.Reply("36");
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var session = await peer.ConnectSessionAsync();
        Assert.Equal("SIM-6H", (await session.IdentifyAsync(s_none)).Model);
        Assert.Equal(
            StandardEvents.CommandError | StandardEvents.QueryError,
            await session.ReadEventStatusAsync(s_none)
        );
        await session.ResetAsync(TimeSpan.FromSeconds(2), s_none);
        await session.ClearStatusAsync(s_none);
        // the reply proves *CLS arrived first
        await session.WaitOperationCompleteAsync(TimeSpan.FromSeconds(2), s_none);
        Assert.Equal(["*IDN?", "*ESR?", "*RST", "*OPC?", "*CLS", "*OPC?"], peer.Received);
    }
}
