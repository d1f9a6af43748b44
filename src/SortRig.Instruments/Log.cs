using Microsoft.Extensions.Logging;

namespace SortRig.Instruments;

/// <summary>Source-generated log messages of the instrument layer. Event ids 1000-1999.</summary>
internal static partial class Log
{
    [LoggerMessage(EventId = 1001, Level = LogLevel.Debug, Message = "{Endpoint} > {Command}")]
    public static partial void Sent(ILogger logger, string endpoint, string command);

    [LoggerMessage(
        EventId = 1002,
        Level = LogLevel.Debug,
        Message = "{Endpoint} > {Command} < {Reply} ({ElapsedMs:0.0} ms)"
    )]
    public static partial void Exchanged(
        ILogger logger,
        string endpoint,
        string command,
        string reply,
        double elapsedMs
    );

    [LoggerMessage(
        EventId = 1003,
        Level = LogLevel.Warning,
        Message = "{Endpoint}: instrument error {Code},\"{Text}\" after {Command}"
    )]
    public static partial void InstrumentError(ILogger logger, string endpoint, int code, string text, string command);

    [LoggerMessage(
        EventId = 1004,
        Level = LogLevel.Warning,
        Message = "{Endpoint}: session broken after {Command}: {Reason}"
    )]
    public static partial void SessionBroken(ILogger logger, string endpoint, string command, string reason);

    [LoggerMessage(
        EventId = 1005,
        Level = LogLevel.Debug,
        Message = "{Endpoint}: dropped stale reply {Reply} of a cancelled query before {Command}"
    )]
    public static partial void DroppedStaleReply(ILogger logger, string endpoint, string reply, string command);

    [LoggerMessage(
        EventId = 1006,
        Level = LogLevel.Information,
        Message = "{Endpoint}: configured {Function} range {Range} NPLC {Nplc}"
    )]
    public static partial void Configured(ILogger logger, string endpoint, string function, double range, double nplc);

    [LoggerMessage(
        EventId = 1007,
        Level = LogLevel.Warning,
        Message = "{Endpoint}: setup check failed: expected range {Range} NPLC {Nplc}, meter has range {ActualRange} "
            + "NPLC {ActualNplc}"
    )]
    public static partial void SetupLost(
        ILogger logger,
        string endpoint,
        double range,
        double nplc,
        double actualRange,
        double actualNplc
    );
}
