using Microsoft.Extensions.Logging;

namespace SortRig.Reporting;

/// <summary>Source-generated log messages of SortRig.Reporting. Event ids 5000-5999.</summary>
internal static partial class Log
{
    [LoggerMessage(
        EventId = 5001,
        Level = LogLevel.Information,
        Message = "Report written to {Folder}: {PartCount} parts, {ChannelCount} drift channels, {FileCount} files"
    )]
    public static partial void ReportWritten(
        ILogger logger,
        string folder,
        int partCount,
        int channelCount,
        int fileCount
    );

    [LoggerMessage(
        EventId = 5002,
        Level = LogLevel.Information,
        Message = "Drift channel {Channel}: no joint drift/tempco fit ({Reason})"
    )]
    public static partial void NoJointFit(ILogger logger, string channel, string reason);
}
