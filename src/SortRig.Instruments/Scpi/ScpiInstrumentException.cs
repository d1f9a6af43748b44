namespace SortRig.Instruments.Scpi;

/// <summary>
/// The instrument reported an error in its error queue after a command group. Carries the first
/// error's code, text and class, the commands of the group, and every error drained.
/// </summary>
public sealed class ScpiInstrumentException : InstrumentException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="code">First error's code (SCPI-99 vol. 2 ch. 21).</param>
    /// <param name="message">First error's text as the instrument gave it.</param>
    /// <param name="command">The command or command group (joined with "; ") after which the error was found.</param>
    /// <param name="errors">All errors drained from the queue; defaults to the first alone.</param>
    public ScpiInstrumentException(int code, string message, string command, IReadOnlyList<ScpiError>? errors = null)
        : base(Describe(code, message, command, errors))
    {
        Code = code;
        InstrumentMessage = message;
        Command = command;
        Errors = errors ?? [new ScpiError(code, message)];
    }

    /// <summary>First error's code.</summary>
    public int Code { get; }

    /// <summary>First error's text as the instrument gave it.</summary>
    public string InstrumentMessage { get; }

    /// <summary>The command group after which the error was found.</summary>
    public string Command { get; }

    /// <summary>The SCPI-99 class of <see cref="Code"/>.</summary>
    public ScpiErrorClass Class => ScpiError.Classify(Code);

    /// <summary>Every error drained from the queue, oldest first.</summary>
    public IReadOnlyList<ScpiError> Errors { get; }

    private static string Describe(int code, string message, string command, IReadOnlyList<ScpiError>? errors)
    {
        var more = errors is { Count: > 1 }
            ? $" (+{errors.Count - 1} more: {string.Join("; ", errors.Skip(1))})"
            : string.Empty;
        return $"instrument {ScpiError.Classify(code)} error {code},\"{message}\" after '{command}'{more}";
    }
}
