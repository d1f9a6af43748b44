using System.Text;
using System.Threading.Channels;
using Microsoft.Extensions.Logging;
using SortRig.Simulator.Faults;
using SortRig.Simulator.Meter;
using SortRig.Simulator.Scpi;

namespace SortRig.Simulator.Serving;

/// <summary>
/// Serves one byte stream (a TCP client or the serial line): one program message per line in, one
/// reply line per message with queries out. Reply faults are applied here. A reply whose query was
/// followed by a new message before the reply went out is discarded with -410 (IEEE 488.2 sec. 6.3.2.3).
/// </summary>
internal sealed class ConnectionLoop
{
    private readonly ScpiDevice _device;
    private readonly Stream _stream;
    private readonly string _name;
    private readonly bool _serial;
    private readonly TimeProvider _time;
    private readonly ILogger _logger;
    private readonly ScpiSession _session = new();
    private DateTimeOffset _silentUntil = DateTimeOffset.MinValue;

    public ConnectionLoop(
        ScpiDevice device,
        Stream stream,
        string name,
        bool serial,
        TimeProvider time,
        ILogger logger
    ) => (_device, _stream, _name, _serial, _time, _logger) = (device, stream, name, serial, time, logger);

    /// <summary>Runs until end of input, a dropped connection (TCP) or cancellation.</summary>
    public async Task RunAsync(CancellationToken ct)
    {
        var inbox = Channel.CreateUnbounded<Inbound>(
            new UnboundedChannelOptions { SingleReader = true, SingleWriter = true }
        );
        using var linked = CancellationTokenSource.CreateLinkedTokenSource(ct);
        var pump = PumpAsync(inbox.Writer, linked.Token);
        try
        {
            await foreach (var item in inbox.Reader.ReadAllAsync(linked.Token).ConfigureAwait(false))
            {
                if (!await HandleAsync(item, inbox.Reader, linked.Token).ConfigureAwait(false))
                {
                    return;
                }
            }
        }
        finally
        {
            await linked.CancelAsync().ConfigureAwait(false);
            await pump.ConfigureAwait(false);
        }
    }

    private async Task PumpAsync(ChannelWriter<Inbound> writer, CancellationToken ct)
    {
        var reader = new LineReader(_stream);
        try
        {
            while (await reader.ReadAsync(ct).ConfigureAwait(false) is Inbound item)
            {
                await writer.WriteAsync(item, ct).ConfigureAwait(false);
            }
        }
        catch (Exception ex) when (ex is OperationCanceledException or IOException or ObjectDisposedException)
        {
            // End of this connection.
        }
        finally
        {
            writer.TryComplete();
        }
    }

    /// <summary>Handles one inbound item; false when the connection must be dropped.</summary>
    private async Task<bool> HandleAsync(Inbound item, ChannelReader<Inbound> inbox, CancellationToken ct)
    {
        if (_serial && _time.GetUtcNow() < _silentUntil)
        {
            return true; // deaf after a serial drop: input is discarded
        }

        switch (item.Kind)
        {
            case InboundKind.Overrun:
                _device.PushError(ScpiError.InputBufferOverrun);
                return true;
            case InboundKind.Unterminated:
                if (item.Text.Contains('?', StringComparison.Ordinal))
                {
                    _device.PushError(ScpiError.QueryUnterminated);
                }

                return true;
        }

        _logger.Received(_name, item.Text);
        var reply = await _device
            .ExecuteAsync(item.Text, _session, k => _logger.FaultInjected(k, _name), ct)
            .ConfigureAwait(false);
        if (reply is null)
        {
            return true;
        }

        var fault = _device.Faults.TakeReplyFault();
        if (fault is FaultKind kind)
        {
            _logger.FaultInjected(kind, _name);
        }

        switch (fault)
        {
            case FaultKind.DropConnection when _serial:
                _silentUntil = _time.GetUtcNow() + _device.Faults.SerialSilence;
                return true;
            case FaultKind.DropConnection:
                return false;
            case FaultKind.DelayReply:
                await Task.Delay(_device.Faults.ReplyDelay, _time, ct).ConfigureAwait(false);
                break;
            case FaultKind.GarbleReply:
                reply = _device.Faults.Garble(reply);
                break;
        }

        if (inbox.TryPeek(out _))
        {
            _device.PushError(ScpiError.QueryInterrupted);
            return true;
        }

        _logger.Replied(_name, reply);
        await _stream.WriteAsync(Encoding.ASCII.GetBytes(reply + "\n"), ct).ConfigureAwait(false);
        await _stream.FlushAsync(ct).ConfigureAwait(false);
        return true;
    }
}
