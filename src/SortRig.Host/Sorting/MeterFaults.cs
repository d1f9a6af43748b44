using System.Net.Sockets;
using SortRig.Instruments;
using SortRig.Instruments.Drivers;
using SortRig.Instruments.Profiles;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Scpi;
using SortRig.Instruments.Transports;

namespace SortRig.Host.Sorting;

/// <summary>Which exceptions are a meter fault to recover from, and how to say them to a person.</summary>
internal static class MeterFaults
{
    /// <summary>True for faults a reconnect can cure; false for configuration mistakes, which must stop the session.</summary>
    public static bool IsFault(Exception e) => e switch
    {
        ResourceStringException or ProfileException or InstrumentSetupException => false,
        InstrumentException => true,
        IOException or SocketException or ObjectDisposedException => true,
        _ => false,
    };

    /// <summary>A short plain description for the operator.</summary>
    public static string Describe(Exception e) => e switch
    {
        InstrumentTimeoutException => "no answer in time",
        InstrumentLinkException => "connection lost",
        ScpiResponseException => "garbled reply",
        ScpiInstrumentException s => $"instrument error {s.Code}",
        _ => e.GetType().Name,
    };
}
