namespace SortRig.Instruments.Scpi;

/// <summary>Bits of the IEEE 488.2 Standard Event Status Register, as read by *ESR? (sec. 11.5.1).</summary>
[Flags]
public enum StandardEvents
{
    /// <summary>No bit set.</summary>
    None = 0,

    /// <summary>Bit 0 (1): operation complete, set by *OPC.</summary>
    OperationComplete = 1,

    /// <summary>Bit 1 (2): request control.</summary>
    RequestControl = 2,

    /// <summary>Bit 2 (4): query error.</summary>
    QueryError = 4,

    /// <summary>Bit 3 (8): device-dependent error.</summary>
    DeviceDependentError = 8,

    /// <summary>Bit 4 (16): execution error.</summary>
    ExecutionError = 16,

    /// <summary>Bit 5 (32): command error.</summary>
    CommandError = 32,

    /// <summary>Bit 6 (64): user request.</summary>
    UserRequest = 64,

    /// <summary>Bit 7 (128): power on.</summary>
    PowerOn = 128,
}
