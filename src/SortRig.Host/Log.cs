using Microsoft.Extensions.Logging;

namespace SortRig.Host;

/// <summary>Source-generated log messages of the host. Event ids 7000-7999 (see SortRig.Engine's Log for the
/// ranges).</summary>
internal static partial class Log
{
    [LoggerMessage(
        EventId = 7001,
        Level = LogLevel.Error,
        Message = "Sorting failed: {Reason} (details in the log file, logs/)"
    )]
    public static partial void SortFailed(ILogger logger, string reason, Exception exception);

    [LoggerMessage(EventId = 7002, Level = LogLevel.Error, Message = "Drift logging failed")]
    public static partial void DriftFailed(ILogger logger, Exception exception);
}
