namespace SortRig.Simulator.Meter;

/// <summary>
/// IEEE 488.2 status reporting: Standard Event Status Register (ESR) with its enable mask (ESE),
/// and the Status Byte (STB) with its service request enable (SRE). IEEE 488.2-1992 sec. 11.
/// </summary>
internal sealed class StatusRegisters
{
    public const int OperationComplete = 1 << 0;
    public const int QueryError = 1 << 2;
    public const int DeviceError = 1 << 3;
    public const int ExecutionError = 1 << 4;
    public const int CommandError = 1 << 5;
    public const int PowerOn = 1 << 7;

    public const int ErrorAvailable = 1 << 2; // STB bit 2: error queue not empty (SCPI-99 vol. 1 sec. 9)
    public const int EventSummary = 1 << 5; // STB bit 5: ESB
    public const int MasterSummary = 1 << 6; // STB bit 6: MSS

    private readonly Lock _gate = new();
    private int _esr = PowerOn;

    public int EventEnable { get; set; }

    public int ServiceRequestEnable { get; set; }

    /// <summary>Sets the ESR bit that matches the class of an error code.</summary>
    public void Record(ScpiError error)
    {
        var bit = error.Code switch
        {
            <= -100 and > -200 => CommandError,
            <= -200 and > -300 => ExecutionError,
            <= -300 and > -400 => DeviceError,
            <= -400 and > -500 => QueryError,
            _ => 0,
        };
        Set(bit);
    }

    public void Set(int bits)
    {
        lock (_gate)
        {
            _esr |= bits;
        }
    }

    /// <summary>*ESR?: reads and clears the event register.</summary>
    public int ReadAndClearEvents()
    {
        lock (_gate)
        {
            var value = _esr;
            _esr = 0;
            return value;
        }
    }

    public void ClearEvents()
    {
        lock (_gate)
        {
            _esr = 0;
        }
    }

    /// <summary>*STB?: the status byte for the current error queue length (MAV is never set: replies are sent at
    /// once).</summary>
    public int StatusByte(int errorCount)
    {
        int esr;
        lock (_gate)
        {
            esr = _esr;
        }

        var stb = (errorCount > 0 ? ErrorAvailable : 0) | ((esr & EventEnable) != 0 ? EventSummary : 0);
        return (stb & ServiceRequestEnable & ~MasterSummary) != 0 ? stb | MasterSummary : stb;
    }
}
