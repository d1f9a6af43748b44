using System.Text;

namespace SortRig.Instruments.Transports;

/// <summary>
/// Line framing over any byte stream. One stream read is kept pending across timeouts, so a
/// read that outlives our timeout is picked up by the next call instead of losing its bytes.
/// </summary>
internal partial class StreamMessageLink : IMessageLink
{
    private readonly Stream _stream;
    private readonly TimeProvider _time;
    private readonly LineBuffer _lines;
    private readonly byte[] _chunk = new byte[4096];
    private Task<int>? _pendingRead;
    private string? _brokenBecause;
    private bool _disposed;

    public StreamMessageLink(string endpoint, Stream stream, MessageLinkOptions options, TimeProvider time)
    {
        Endpoint = endpoint;
        _stream = stream;
        Options = options;
        _time = time;
        _lines = new LineBuffer(options.Terminator, options.MaxLineLength);
    }

    public string Endpoint { get; }

    public bool IsBroken => _brokenBecause is not null;

    protected MessageLinkOptions Options { get; }

    public async ValueTask WriteLineAsync(string line, CancellationToken ct)
    {
        ThrowIfUnusable();
        if (line.Contains(Options.Terminator, StringComparison.Ordinal))
        {
            throw new ArgumentException(
                $"the line must not contain the terminator {Escape(Options.Terminator)}",
                nameof(line)
            );
        }

        ct.ThrowIfCancellationRequested();
        var bytes = Encoding.ASCII.GetBytes(line + Options.Terminator);
        using var timeoutCts = new CancellationTokenSource(Options.WriteTimeout, _time);
        using var linked = CancellationTokenSource.CreateLinkedTokenSource(ct, timeoutCts.Token);
        try
        {
            await WriteCoreAsync(bytes).WaitAsync(linked.Token).ConfigureAwait(false);
        }
        catch (OperationCanceledException ex)
        {
            // A write abandoned half way leaves the instrument's parser in an unknown state.
            Break("a write was abandoned");
            if (ct.IsCancellationRequested)
            {
                throw;
            }

            throw new InstrumentTimeoutException(line, Options.WriteTimeout, ex);
        }
        catch (Exception ex) when (IsIoFault(ex))
        {
            Break($"write failed: {ex.Message}");
            throw new InstrumentLinkException(Endpoint, $"write failed: {ex.Message}", ex);
        }
    }

    public async ValueTask<string> ReadLineAsync(TimeSpan timeout, CancellationToken ct)
    {
        ThrowIfUnusable();
        ArgumentOutOfRangeException.ThrowIfLessThanOrEqual(timeout, TimeSpan.Zero);
        using var timeoutCts = new CancellationTokenSource(timeout, _time);
        using var linked = CancellationTokenSource.CreateLinkedTokenSource(ct, timeoutCts.Token);
        while (true)
        {
            if (_lines.TryTakeLine(out var line))
            {
                return line;
            }

            if (_lines.IsOverfull)
            {
                Break($"a reply exceeded {Options.MaxLineLength} bytes without a terminator");
                throw new InstrumentLinkException(Endpoint, _brokenBecause!);
            }

            try
            {
                var n = await NextChunkAsync(linked.Token).ConfigureAwait(false);
                _lines.Append(_chunk.AsSpan(0, n));
            }
            catch (OperationCanceledException ex)
                when (!ct.IsCancellationRequested && timeoutCts.IsCancellationRequested)
            {
                throw new InstrumentTimeoutException(null, timeout, ex);
            }
        }
    }

    public async ValueTask DiscardInputAsync(TimeSpan quietPeriod, CancellationToken ct)
    {
        ThrowIfUnusable();
        _lines.Clear();
        if (_pendingRead is { IsCompletedSuccessfully: true })
        {
            _pendingRead = null;
        }

        // Bounded: an instrument that never stops talking cannot hold us here for ever.
        for (var i = 0; i < 256 && quietPeriod > TimeSpan.Zero; i++)
        {
            using var quietCts = new CancellationTokenSource(quietPeriod, _time);
            using var linked = CancellationTokenSource.CreateLinkedTokenSource(ct, quietCts.Token);
            try
            {
                _ = await NextChunkAsync(linked.Token).ConfigureAwait(false);
            }
            catch (OperationCanceledException) when (!ct.IsCancellationRequested)
            {
                return;
            }
        }
    }

    public async ValueTask DisposeAsync()
    {
        if (_disposed)
        {
            return;
        }

        _disposed = true;
        await ReleaseOwnedAsync().ConfigureAwait(false);
        await _stream.DisposeAsync().ConfigureAwait(false);

        // A read still blocked in the OS ends with an error once the handle closes; observe it.
        _pendingRead?.ContinueWith(
            static t => _ = t.Exception,
            CancellationToken.None,
            TaskContinuationOptions.OnlyOnFaulted,
            TaskScheduler.Default
        );
        GC.SuppressFinalize(this);
    }

    /// <summary>Releases what a derived link owns besides the stream (socket, serial port).</summary>
    protected virtual ValueTask ReleaseOwnedAsync() => ValueTask.CompletedTask;

    /// <summary>True when a read fault only means "no data yet" (USBTMC's kernel read timeout).</summary>
    protected virtual bool IsNoDataYet(Exception ex) => false;

    private static bool IsIoFault(Exception ex) =>
        ex
            is IOException
                or ObjectDisposedException
                or UnauthorizedAccessException
                or InvalidOperationException
                or System.Net.Sockets.SocketException;

    private static string Escape(string s) =>
        s.Replace("\r", "\\r", StringComparison.Ordinal).Replace("\n", "\\n", StringComparison.Ordinal);

    private async Task WriteCoreAsync(byte[] bytes)
    {
        await _stream.WriteAsync(bytes).ConfigureAwait(false);
        await _stream.FlushAsync().ConfigureAwait(false);
    }

    private async Task<int> ReadChunkAsync() => await _stream.ReadAsync(_chunk).ConfigureAwait(false);
}
