namespace SortRig.Instruments;

/// <summary>
/// Base of every fault raised by the instrument layer (link, SCPI, profile, resource string),
/// so a caller can catch instrument trouble in one place.
/// </summary>
public abstract class InstrumentException : Exception
{
    /// <summary>Creates the exception with a message and an optional cause.</summary>
    protected InstrumentException(string message, Exception? innerException = null)
        : base(message, innerException) { }
}
