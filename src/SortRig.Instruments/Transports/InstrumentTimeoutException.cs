namespace SortRig.Instruments.Transports;

/// <summary>
/// The instrument did not answer (or accept a write) within our timeout. Raised only when the
/// caller did not cancel; caller cancellation stays an <see cref="OperationCanceledException"/>.
/// </summary>
public sealed class InstrumentTimeoutException : InstrumentException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="command">The command whose reply was awaited, or null at link level.</param>
    /// <param name="timeout">The timeout that expired.</param>
    /// <param name="innerException">The cancellation that the timeout caused, if any.</param>
    public InstrumentTimeoutException(string? command, TimeSpan timeout, Exception? innerException = null)
        : base(Describe(command, timeout), innerException)
    {
        Command = command;
        Timeout = timeout;
    }

    /// <summary>The command whose reply was awaited; null when raised by a bare link read.</summary>
    public string? Command { get; }

    /// <summary>The timeout that expired.</summary>
    public TimeSpan Timeout { get; }

    private static string Describe(string? command, TimeSpan timeout) =>
        command is null
            ? $"no complete reply from the instrument within {timeout.TotalMilliseconds:0} ms"
            : $"no reply to '{command}' within {timeout.TotalMilliseconds:0} ms";
}
