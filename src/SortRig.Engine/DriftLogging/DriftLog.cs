using Microsoft.Extensions.Logging;

namespace SortRig.Engine.DriftLogging;

/// <summary>Source-generated log messages of the drift job (event ids 36xx).</summary>
internal static partial class DriftLog
{
    [LoggerMessage(EventId = 3601, Level = LogLevel.Information, Message = "Drift run {RunId} '{Name}' started: {Channels} channels every {IntervalSeconds} s")]
    public static partial void Started(ILogger logger, long runId, string name, int channels, double intervalSeconds);

    [LoggerMessage(EventId = 3602, Level = LogLevel.Warning, Message = "Drift run {RunId}: meter fault {Kind}: {Reason}")]
    public static partial void MeterFault(ILogger logger, long runId, string kind, string reason);

    [LoggerMessage(EventId = 3603, Level = LogLevel.Warning, Message = "Drift run {RunId}: gap {From:O} .. {To:O} ({Reason})")]
    public static partial void GapMarked(ILogger logger, long runId, DateTimeOffset from, DateTimeOffset to, string reason);

    [LoggerMessage(EventId = 3604, Level = LogLevel.Warning, Message = "Drift run {RunId}: {Count} scan times skipped (a scan or an outage outlasted the interval)")]
    public static partial void SkippedTicks(ILogger logger, long runId, long count);

    [LoggerMessage(EventId = 3605, Level = LogLevel.Warning, Message = "Drift run {RunId}: storage fault {Fault} ({Reason}); retrying in {DelaySeconds} s")]
    public static partial void StorageRetry(ILogger logger, long runId, string fault, string reason, double delaySeconds);

    [LoggerMessage(EventId = 3606, Level = LogLevel.Information, Message = "Drift run {RunId} finished: {Scans} scans, {Samples} samples stored, {Gaps} gaps")]
    public static partial void Finished(ILogger logger, long runId, long scans, long samples, int gaps);
}
