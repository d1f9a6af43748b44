namespace SortRig.Simulator.Meter;

/// <summary>One entry of the SCPI error/event queue (SCPI-99 vol. 2 ch. 21 codes).</summary>
internal readonly record struct ScpiError(int Code, string Message)
{
    public static readonly ScpiError None = new(0, "No error");
    public static readonly ScpiError Command = new(-100, "Command error");
    public static readonly ScpiError Syntax = new(-102, "Syntax error");
    public static readonly ScpiError DataType = new(-104, "Data type error");
    public static readonly ScpiError ParameterNotAllowed = new(-108, "Parameter not allowed");
    public static readonly ScpiError MissingParameter = new(-109, "Missing parameter");
    public static readonly ScpiError UndefinedHeader = new(-113, "Undefined header");
    public static readonly ScpiError InvalidSuffix = new(-131, "Invalid suffix");
    public static readonly ScpiError TriggerIgnored = new(-211, "Trigger ignored");
    public static readonly ScpiError InitIgnored = new(-213, "Init ignored");
    public static readonly ScpiError TriggerDeadlock = new(-214, "Trigger deadlock");
    public static readonly ScpiError SettingsConflict = new(-221, "Settings conflict");
    public static readonly ScpiError DataOutOfRange = new(-222, "Data out of range");
    public static readonly ScpiError TooMuchData = new(-223, "Too much data");
    public static readonly ScpiError IllegalParameterValue = new(-224, "Illegal parameter value");
    public static readonly ScpiError DataStale = new(-230, "Data corrupt or stale");
    public static readonly ScpiError SystemError = new(-310, "System error");
    public static readonly ScpiError QueueOverflow = new(-350, "Queue overflow");
    public static readonly ScpiError InputBufferOverrun = new(-363, "Input buffer overrun");
    public static readonly ScpiError QueryInterrupted = new(-410, "Query INTERRUPTED");
    public static readonly ScpiError QueryUnterminated = new(-420, "Query UNTERMINATED");

    /// <summary>The SYSTem:ERRor? reply body: <c>-113,"Undefined header"</c>.</summary>
    public string Format() => $"{Code},\"{Message}\"";
}
