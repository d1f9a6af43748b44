namespace SortRig.Instruments.Scpi;

/// <summary>
/// A reply arrived but is not what the command must return (e.g. text where a number is
/// expected). The exchange stayed in step, so the session remains usable.
/// </summary>
public sealed class ScpiResponseException : InstrumentException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="command">The command that was sent.</param>
    /// <param name="reply">The reply text as received.</param>
    /// <param name="expected">What the reply should have been, e.g. "a number (NR1, NR2 or NR3)".</param>
    public ScpiResponseException(string command, string reply, string expected)
        : base($"reply to '{command}' was '{reply}', expected {expected}")
    {
        Command = command;
        Reply = reply;
        Expected = expected;
    }

    /// <summary>The command that was sent.</summary>
    public string Command { get; }

    /// <summary>The reply text as received.</summary>
    public string Reply { get; }

    /// <summary>What the reply should have been.</summary>
    public string Expected { get; }
}
