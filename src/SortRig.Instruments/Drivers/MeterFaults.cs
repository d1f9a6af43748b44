using System.Net.Sockets;
using SortRig.Instruments;
using SortRig.Instruments.Profiles;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Scpi;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Drivers;

/// <summary>Which exceptions are a meter fault to recover from, and how to say them to a person.</summary>
public static class MeterFaults
{
    /// <summary>True for faults a reconnect can cure; false for configuration mistakes, which must stop the
    /// session.</summary>
    public static bool IsFault(Exception e) =>
        e switch
        {
            ResourceStringException
            or ProfileException
            or InstrumentSetupException
            or MeterUnreadableException
            or MeterUnreachableException => false,
            InstrumentException => true,
            IOException or SocketException or ObjectDisposedException => true,
            _ => false,
        };

    /// <summary>
    /// Setup read-backs that differ (or a model that does not match) in a row before the session
    /// stops: a garbled reply or a reset between the commands and the read-back passes, a wrong
    /// configuration does not.
    /// </summary>
    public const int SetupRetries = 5;

    /// <summary>
    /// Attempts to open a link that was never open before a job stops with <see cref="MeterUnreachableException"/>: 4,
    /// about 1.75 s with the sort's back-off (0.25 s doubling). A meter reached once and lost later is retried
    /// without limit.
    /// </summary>
    public const int FirstConnectAttempts = 4;

    /// <summary>
    /// True for faults worth another connection attempt: every <see cref="IsFault"/>, and a setup
    /// mismatch while <paramref name="setupMayRetry"/> (never a transport the profile does not allow).
    /// </summary>
    public static bool IsRetryable(Exception e, bool setupMayRetry) =>
        IsFault(e) || (setupMayRetry && e is InstrumentSetupException { Setting: not "transport" });

    /// <summary>A short plain description for the operator.</summary>
    public static string Describe(Exception e) =>
        e switch
        {
            InstrumentTimeoutException => "no answer in time",
            ScpiResponseException r when r.Expected.StartsWith("a reading", StringComparison.Ordinal) =>
                $"not a number ('{ReplyText.Printable(r.Reply)}')",
            InstrumentSetupException s => $"setting read back wrong ({s.Message})",
            InstrumentLinkException { OpenFailed: true } l => $"not reached ({l.Message})",
            InstrumentLinkException => "connection lost",
            ScpiResponseException => "garbled reply",
            ScpiInstrumentException s => $"instrument error {s.Code}",
            _ => e.GetType().Name,
        };
}
