using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Drivers;

/// <summary>
/// The meter was never reached: every attempt to open the link failed (refused, not answered, no such device)
/// before any connection existed. Not a fault to wait out but a setup to check, so the job stops and says what
/// was tried.
/// </summary>
public sealed class MeterUnreachableException : InstrumentException
{
    /// <summary>Creates the exception.</summary>
    /// <param name="attempts">Attempts made.</param>
    /// <param name="waited">Time spent waiting between them.</param>
    /// <param name="last">The last attempt's failure.</param>
    public MeterUnreachableException(int attempts, TimeSpan waited, InstrumentLinkException last)
        : base(
            string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"cannot reach the meter: {last?.Message} ({attempts} attempts over {waited.TotalSeconds:0.##} s); "
                    + $"check that it is switched on, the resource string (address, port or device) and the cable"
            ),
            last
        )
    {
        ArgumentNullException.ThrowIfNull(last);
        Attempts = attempts;
        Endpoint = last.Endpoint;
    }

    /// <summary>Attempts made.</summary>
    public int Attempts { get; }

    /// <summary>What was tried (resource text or device path).</summary>
    public string Endpoint { get; }
}
