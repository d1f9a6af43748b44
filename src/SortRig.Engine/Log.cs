using Microsoft.Extensions.Logging;

namespace SortRig.Engine;

/// <summary>Source-generated log messages of the engine. Event ids 6000-6999: 60xx announcing, 61xx sorting, 62xx
/// drift.</summary>
/// <remarks>Ranges by project: Instruments 1xxx, Simulator 2xxx, Storage 3xxx, Planning 4xxx, Reporting 5xxx, Engine
/// 6xxx, Host 7xxx.</remarks>
internal static partial class Log
{
    [LoggerMessage(EventId = 6001, Level = LogLevel.Warning, Message = "Speech failed: {Reason}")]
    public static partial void SpeechFailed(ILogger logger, string reason);

    [LoggerMessage(EventId = 6101, Level = LogLevel.Warning, Message = "Meter fault {Kind}: {Reason}")]
    public static partial void SortMeterFault(ILogger logger, string kind, string reason);

    [LoggerMessage(
        EventId = 6102,
        Level = LogLevel.Error,
        Message = "Storage fault during {Operation} ({Fault}): {Reason}"
    )]
    public static partial void SortStorageFault(ILogger logger, string operation, string fault, string reason);

    [LoggerMessage(
        EventId = 6201,
        Level = LogLevel.Information,
        Message = "Drift run {RunId} '{Name}' started: {Channels} channels every {IntervalSeconds} s"
    )]
    public static partial void DriftStarted(
        ILogger logger,
        long runId,
        string name,
        int channels,
        double intervalSeconds
    );

    [LoggerMessage(
        EventId = 6202,
        Level = LogLevel.Warning,
        Message = "Drift run {RunId}: meter fault {Kind}: {Reason}"
    )]
    public static partial void DriftMeterFault(ILogger logger, long runId, string kind, string reason);

    [LoggerMessage(
        EventId = 6203,
        Level = LogLevel.Warning,
        Message = "Drift run {RunId}: gap {From:O} .. {To:O} ({Reason})"
    )]
    public static partial void DriftGapMarked(
        ILogger logger,
        long runId,
        DateTimeOffset from,
        DateTimeOffset to,
        string reason
    );

    [LoggerMessage(
        EventId = 6204,
        Level = LogLevel.Warning,
        Message = "Drift run {RunId}: {Count} scan times skipped (a scan or an outage outlasted the interval)"
    )]
    public static partial void DriftSkippedTicks(ILogger logger, long runId, long count);

    [LoggerMessage(
        EventId = 6205,
        Level = LogLevel.Warning,
        Message = "Drift run {RunId}: storage fault {Fault} ({Reason}); retrying in {DelaySeconds} s"
    )]
    public static partial void DriftStorageRetry(
        ILogger logger,
        long runId,
        string fault,
        string reason,
        double delaySeconds
    );

    [LoggerMessage(
        EventId = 6290,
        Level = LogLevel.Warning,
        Message = "Drift run {RunId}: the store took no samples for {Seconds} s (buffer full); the scans missed are "
            + "marked as a gap"
    )]
    public static partial void DriftHeldBack(ILogger logger, long runId, double seconds);

    [LoggerMessage(
        EventId = 6206,
        Level = LogLevel.Information,
        Message = "Drift run {RunId} finished: {Scans} scans, {Samples} samples stored, {Gaps} gaps"
    )]
    public static partial void DriftFinished(ILogger logger, long runId, long scans, long samples, int gaps);
}
