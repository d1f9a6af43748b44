using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Scpi;

/// <summary>One exchange on the link: owed replies first, then write, then read; faults break the session.</summary>
public sealed partial class ScpiSession : IAsyncDisposable
{
    private async Task<string?> ExchangeLockedAsync(
        string command,
        TimeSpan? replyTimeout,
        CancellationToken ct,
        bool track = true
    )
    {
        var written = false;
        if (_brokenBecause is not null)
        {
            throw new InstrumentLinkException(Endpoint, $"session is broken ({_brokenBecause}); reconnect to go on");
        }

        try
        {
            await CollectOwedRepliesAsync(command, ct).ConfigureAwait(false);
            var started = _time.GetTimestamp();
            await _link.WriteLineAsync(command, ct).ConfigureAwait(false);
            written = true;
            if (track)
            {
                _group.Add(command);
            }

            if (replyTimeout is not { } timeout)
            {
                Log.Sent(_logger, Endpoint, command);
                return null;
            }

            var reply = await _link.ReadLineAsync(timeout, ct).ConfigureAwait(false);
            Log.Exchanged(_logger, Endpoint, command, reply, _time.GetElapsedTime(started).TotalMilliseconds);
            return reply;
        }
        catch (InstrumentTimeoutException ex)
        {
            MarkBroken(command, ex.Message);
            throw new InstrumentTimeoutException(command, ex.Timeout, ex);
        }
        catch (InstrumentLinkException ex)
        {
            MarkBroken(command, ex.Message);
            throw;
        }
        catch (OperationCanceledException) when (ct.IsCancellationRequested && written && replyTimeout is not null)
        {
            // The reply may still come; it is read and dropped before the next exchange so replies stay in step.
            _owedReplies++;
            throw;
        }
    }

    private async Task CollectOwedRepliesAsync(string nextCommand, CancellationToken ct)
    {
        while (_owedReplies > 0)
        {
            try
            {
                var stale = await _link.ReadLineAsync(Options.QueryTimeout, ct).ConfigureAwait(false);
                _owedReplies--;
                Log.DroppedStaleReply(_logger, Endpoint, stale, nextCommand);
            }
            catch (InstrumentTimeoutException)
            {
                // The instrument dropped the cancelled query's reply; nothing more is owed.
                _owedReplies = 0;
            }
        }
    }

    private void MarkBroken(string command, string reason)
    {
        _brokenBecause ??= $"after '{command}': {reason}";
        Log.SessionBroken(_logger, Endpoint, command, reason);
    }
}
