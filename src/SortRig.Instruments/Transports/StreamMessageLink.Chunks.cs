namespace SortRig.Instruments.Transports;

/// <summary>The one pending stream read, and the broken state it can set.</summary>
internal partial class StreamMessageLink : IMessageLink
{
    private async Task<int> NextChunkAsync(CancellationToken token)
    {
        while (true)
        {
            _pendingRead ??= ReadChunkAsync();
            int n;
            try
            {
                n = await _pendingRead.WaitAsync(token).ConfigureAwait(false);
            }
            catch (Exception ex) when (ex is not OperationCanceledException && IsNoDataYet(ex))
            {
                _pendingRead = null;
                continue;
            }
            catch (Exception ex) when (IsIoFault(ex))
            {
                _pendingRead = null;
                Break($"read failed: {ex.Message}");
                throw new InstrumentLinkException(Endpoint, _brokenBecause!, ex);
            }

            _pendingRead = null;
            if (n == 0)
            {
                Break("the instrument closed the connection");
                throw new InstrumentLinkException(Endpoint, _brokenBecause!);
            }

            return n;
        }
    }

    private void Break(string reason) => _brokenBecause ??= reason;

    private void ThrowIfUnusable()
    {
        ObjectDisposedException.ThrowIf(_disposed, this);
        if (_brokenBecause is not null)
        {
            throw new InstrumentLinkException(Endpoint, $"link is broken ({_brokenBecause}); reconnect to go on");
        }
    }
}
