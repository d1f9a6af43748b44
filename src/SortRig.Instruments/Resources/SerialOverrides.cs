using System.IO.Ports;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Resources;

/// <summary>
/// Serial settings given explicitly (in a resource string or on the command line); a null
/// field falls back to the profile's or the built-in default.
/// </summary>
public sealed record SerialOverrides(
    int? BaudRate = null,
    Parity? Parity = null,
    int? DataBits = null,
    StopBits? StopBits = null,
    Handshake? Handshake = null
)
{
    /// <summary>No explicit settings.</summary>
    public static SerialOverrides None { get; } = new();

    /// <summary>Fills the missing fields from <paramref name="defaults"/>, validating the result.</summary>
    public SerialSettings ApplyTo(SerialSettings defaults) =>
        new(
            BaudRate ?? defaults.BaudRate,
            Parity ?? defaults.Parity,
            DataBits ?? defaults.DataBits,
            StopBits ?? defaults.StopBits,
            Handshake ?? defaults.Handshake
        );
}
