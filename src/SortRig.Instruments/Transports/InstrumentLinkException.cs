namespace SortRig.Instruments.Transports;

/// <summary>
/// The connection to the instrument failed (I/O fault, peer closed it, could not be opened) or
/// a link or session already marked broken was used again. Reconnect to recover.
/// </summary>
public sealed class InstrumentLinkException : InstrumentException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="endpoint">What the link was connected to (resource text or device path).</param>
    /// <param name="message">What went wrong.</param>
    /// <param name="innerException">The underlying I/O fault, if any.</param>
    /// <param name="openFailed">True when the link could not be opened at all (refused, no answer, no such
    /// device).</param>
    public InstrumentLinkException(
        string endpoint,
        string message,
        Exception? innerException = null,
        bool openFailed = false
    )
        : base($"{endpoint}: {message}", innerException)
    {
        Endpoint = endpoint;
        OpenFailed = openFailed;
    }

    /// <summary>
    /// True when the link could not be opened at all (connection refused or not answered, no such device): the
    /// instrument was not reached, as opposed to a link that broke after it was open.
    /// </summary>
    public bool OpenFailed { get; }

    /// <summary>What the link was connected to (resource text or device path).</summary>
    public string Endpoint { get; }
}
