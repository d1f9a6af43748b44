namespace SortRig.Instruments.Scpi;

/// <summary>The error/event classes of SCPI-99 vol. 2 ch. 21, by code range.</summary>
public enum ScpiErrorClass
{
    /// <summary>0, "No error".</summary>
    None = 0,

    /// <summary>-100..-199: the command was not understood (syntax, header, data type).</summary>
    Command = 1,

    /// <summary>-200..-299: understood but could not be carried out (settings conflict, out of range).</summary>
    Execution = 2,

    /// <summary>-300..-399: the device failed (self-test, calibration, queue overflow).</summary>
    DeviceSpecific = 3,

    /// <summary>-400..-499: output queue trouble (query interrupted, unterminated, deadlocked).</summary>
    Query = 4,

    /// <summary>-500..-599: power on event.</summary>
    PowerOn = 5,

    /// <summary>-600..-699: user request event.</summary>
    UserRequest = 6,

    /// <summary>-700..-799: request control event.</summary>
    RequestControl = 7,

    /// <summary>-800..-899: operation complete event.</summary>
    OperationComplete = 8,

    /// <summary>Positive codes: defined by the device maker.</summary>
    DeviceDefined = 9,

    /// <summary>Other negative codes (reserved by SCPI).</summary>
    Reserved = 10,
}

/// <summary>One entry of the instrument's error queue, as read with SYST:ERR?.</summary>
/// <param name="Code">Error/event number; 0 means no error.</param>
/// <param name="Message">Description text without the quotes.</param>
public sealed record ScpiError(int Code, string Message)
{
    /// <summary>The class of the code (SCPI-99 vol. 2 ch. 21).</summary>
    public ScpiErrorClass Class => Classify(Code);

    /// <summary>Maps a code to its SCPI-99 class.</summary>
    public static ScpiErrorClass Classify(int code) =>
        code switch
        {
            0 => ScpiErrorClass.None,
            > 0 => ScpiErrorClass.DeviceDefined,
            <= -100 and >= -899 => (ScpiErrorClass)(-code / 100),
            _ => ScpiErrorClass.Reserved,
        };

    /// <summary>
    /// Parses a SYST:ERR? reply of the form <c>-113,"Undefined header"</c> (SCPI-99 vol. 2 sec. 21.8;
    /// a doubled quote inside the string stands for one quote).
    /// </summary>
    /// <exception cref="ScpiResponseException">The reply does not have that form.</exception>
    public static ScpiError Parse(string reply, string command)
    {
        var comma = reply.IndexOf(',', StringComparison.Ordinal);
        var codeText = comma < 0 ? reply : reply[..comma];
        if (
            !ScpiNumber.TryParse(codeText, out var number)
            || number.Format != ScpiNumberFormat.NR1
            || number.Value is < int.MinValue or > int.MaxValue
        )
        {
            throw new ScpiResponseException(command, reply, "an error entry <code>,\"<text>\" with an integer code");
        }

        var text = comma < 0 ? string.Empty : reply[(comma + 1)..].Trim();
        if (text.Length >= 2 && text[0] == '"' && text[^1] == '"')
        {
            text = text[1..^1].Replace("\"\"", "\"", StringComparison.Ordinal);
        }

        return new ScpiError((int)number.Value, text);
    }

    /// <inheritdoc/>
    public override string ToString() => $"{Code},\"{Message}\"";
}
