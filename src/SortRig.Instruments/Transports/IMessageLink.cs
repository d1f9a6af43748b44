namespace SortRig.Instruments.Transports;

/// <summary>
/// A line-oriented message channel to one instrument (raw TCP socket, serial port, USBTMC device).
/// Not safe for concurrent use: one reader and one writer at a time (the SCPI session serialises).
/// </summary>
public interface IMessageLink : IAsyncDisposable
{
    /// <summary>What the link is connected to, for messages and logs.</summary>
    string Endpoint { get; }

    /// <summary>
    /// True after an I/O fault or after the peer closed the connection. A broken link refuses
    /// every further call with <see cref="InstrumentLinkException"/>.
    /// </summary>
    bool IsBroken { get; }

    /// <summary>Sends <paramref name="line"/> followed by the link's terminator.</summary>
    /// <exception cref="InstrumentLinkException">I/O fault (the link is then broken).</exception>
    /// <exception cref="InstrumentTimeoutException">The write did not complete within the write timeout (link
    /// broken).</exception>
    ValueTask WriteLineAsync(string line, CancellationToken ct);

    /// <summary>
    /// Reads one line and returns it without its terminator. A timeout does not break the link:
    /// the partial line is kept, and a later read or <see cref="DiscardInputAsync"/> sees it.
    /// </summary>
    /// <param name="timeout">How long to wait for the complete line; must be positive.</param>
    /// <param name="ct">Caller cancellation (raises <see cref="OperationCanceledException"/>).</param>
    /// <exception cref="InstrumentTimeoutException">No complete line within <paramref name="timeout"/>.</exception>
    /// <exception cref="InstrumentLinkException">I/O fault or peer closed (the link is then broken).</exception>
    ValueTask<string> ReadLineAsync(TimeSpan timeout, CancellationToken ct);

    /// <summary>
    /// Drops every byte already received, then keeps reading and dropping until the instrument
    /// has been quiet for <paramref name="quietPeriod"/>. Use after a timeout or garbled reply.
    /// </summary>
    /// <param name="quietPeriod">Silence that ends the discard; zero drops only what is buffered.</param>
    /// <param name="ct">Caller cancellation.</param>
    ValueTask DiscardInputAsync(TimeSpan quietPeriod, CancellationToken ct);
}
