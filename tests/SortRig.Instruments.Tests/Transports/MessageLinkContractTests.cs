using System.Text;
using SortRig.Instruments.Tests.Support;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Tests.Transports;

/// <summary>The far end of a link under test: a real socket or the other pseudo-terminal.</summary>
public interface ILinkPeer : IAsyncDisposable
{
    Task SendAsync(string text);

    Task<string> ReceiveAsync(int length);

    /// <summary>Breaks the connection from the far side.</summary>
    Task DropAsync();
}

/// <summary>A link and its far end.</summary>
public sealed record LinkUnderTest(IMessageLink Link, ILinkPeer Peer) : IAsyncDisposable
{
    public async ValueTask DisposeAsync()
    {
        await Link.DisposeAsync();
        await Peer.DisposeAsync();
    }
}

/// <summary>
/// Behaviour every message link must show, run once per transport by the subclasses.
/// Framing and timeout rules are SortRig's own contract (docs/instruments.md); line
/// termination by LF follows IEEE 488.2 sec. 7.5 (from memory).
/// </summary>
public abstract class MessageLinkContractTests
{
    private static readonly TimeSpan s_wait = TimeSpan.FromSeconds(3);

    protected abstract Task<LinkUnderTest> CreateLinkAsync(MessageLinkOptions options);

    protected Task<LinkUnderTest> CreateLinkAsync() => CreateLinkAsync(MessageLinkOptions.Default);

    [LinkFact]
    public async Task WriteLine_PeerReceivesLineAndTerminator()
    {
        await using var t = await CreateLinkAsync();
        await t.Link.WriteLineAsync("SENS:RES:RANG 10000", CancellationToken.None);
        Assert.Equal("SENS:RES:RANG 10000\n", await t.Peer.ReceiveAsync(20));
    }

    [LinkFact]
    public async Task ReadLine_ReturnsLineWithoutTerminator()
    {
        await using var t = await CreateLinkAsync();
        await t.Peer.SendAsync("+1.00012340E+04\n");
        Assert.Equal("+1.00012340E+04", await t.Link.ReadLineAsync(s_wait, CancellationToken.None));
    }

    [LinkFact]
    public async Task ReadLine_LineArrivesInPieces_ReassemblesIt()
    {
        await using var t = await CreateLinkAsync();
        var read = t.Link.ReadLineAsync(s_wait, CancellationToken.None).AsTask();
        await t.Peer.SendAsync("Bench Test Works,");
        await Task.Delay(50);
        await t.Peer.SendAsync("SIM-6H,SN1,1.0\n");
        Assert.Equal("Bench Test Works,SIM-6H,SN1,1.0", await read);
    }

    [LinkFact]
    public async Task ReadLine_TwoLinesInOneBurst_ReturnsThemInOrder()
    {
        await using var t = await CreateLinkAsync();
        await t.Peer.SendAsync("first\nsecond\n");
        Assert.Equal("first", await t.Link.ReadLineAsync(s_wait, CancellationToken.None));
        Assert.Equal("second", await t.Link.ReadLineAsync(s_wait, CancellationToken.None));
    }

    [LinkFact]
    public async Task ReadLine_CrLfTerminatorConfigured_StripsBoth()
    {
        await using var t = await CreateLinkAsync(new MessageLinkOptions("\r\n"));
        await t.Peer.SendAsync("12.5\r\n");
        Assert.Equal("12.5", await t.Link.ReadLineAsync(s_wait, CancellationToken.None));
        await t.Link.WriteLineAsync("*IDN?", CancellationToken.None);
        Assert.Equal("*IDN?\r\n", await t.Peer.ReceiveAsync(7));
    }

    [LinkFact]
    public async Task ReadLine_PeerSilent_ThrowsTimeoutAndLinkStaysUsable()
    {
        await using var t = await CreateLinkAsync();
        var timeout = TimeSpan.FromMilliseconds(150);
        var ex = await Assert.ThrowsAsync<InstrumentTimeoutException>(() =>
            t.Link.ReadLineAsync(timeout, CancellationToken.None).AsTask()
        );
        Assert.Equal(timeout, ex.Timeout);
        Assert.False(t.Link.IsBroken);
        await t.Peer.SendAsync("late\n");
        Assert.Equal("late", await t.Link.ReadLineAsync(s_wait, CancellationToken.None));
    }

    [LinkFact]
    public async Task ReadLine_CallerCancels_ThrowsOperationCanceledNotTimeout()
    {
        await using var t = await CreateLinkAsync();
        using var cts = new CancellationTokenSource(TimeSpan.FromMilliseconds(100));
        var ex = await Assert.ThrowsAnyAsync<OperationCanceledException>(() =>
            t.Link.ReadLineAsync(TimeSpan.FromSeconds(30), cts.Token).AsTask()
        );
        Assert.IsNotType<InstrumentTimeoutException>(ex);
        Assert.False(t.Link.IsBroken);
    }

    [LinkFact]
    public async Task DiscardInput_DropsStaleReplyAndPartialLine()
    {
        await using var t = await CreateLinkAsync();
        await t.Peer.SendAsync("stale reply\nhalf a li");
        await Task.Delay(100);
        await t.Link.DiscardInputAsync(TimeSpan.FromMilliseconds(100), CancellationToken.None);
        await t.Peer.SendAsync("fresh\n");
        Assert.Equal("fresh", await t.Link.ReadLineAsync(s_wait, CancellationToken.None));
    }

    [LinkFact]
    public async Task PeerDrops_LinkBrokenAndRefusesReuse()
    {
        await using var t = await CreateLinkAsync();
        await t.Peer.DropAsync();
        await Assert.ThrowsAsync<InstrumentLinkException>(() =>
            t.Link.ReadLineAsync(s_wait, CancellationToken.None).AsTask()
        );
        Assert.True(t.Link.IsBroken);
        var again = await Assert.ThrowsAsync<InstrumentLinkException>(() =>
            t.Link.WriteLineAsync("*IDN?", CancellationToken.None).AsTask()
        );
        Assert.Contains("broken", again.Message, StringComparison.Ordinal);
    }

    [LinkFact]
    public async Task WriteLine_LineContainsTerminator_Rejected()
    {
        await using var t = await CreateLinkAsync();
        await Assert.ThrowsAsync<ArgumentException>(() =>
            t.Link.WriteLineAsync("A\nB", CancellationToken.None).AsTask()
        );
    }

    /// <summary>Reads exactly <paramref name="length"/> bytes from a stream, or fails after 3 s.</summary>
    protected static async Task<string> ReceiveExactlyAsync(Stream stream, int length)
    {
        var buffer = new byte[length];
        using var cts = new CancellationTokenSource(s_wait);
        await stream.ReadExactlyAsync(buffer, cts.Token);
        return Encoding.Latin1.GetString(buffer);
    }
}
