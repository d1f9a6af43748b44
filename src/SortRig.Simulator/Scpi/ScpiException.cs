using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Scpi;

/// <summary>Raised inside command handling; the dispatcher turns it into an error-queue entry.</summary>
internal sealed class ScpiException : Exception
{
    public ScpiException(ScpiError error)
        : base($"{error.Code} {error.Message}") => Error = error;

    public ScpiError Error { get; }
}
