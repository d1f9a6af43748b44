using Microsoft.Extensions.Logging;
using SortRig.Simulator.Faults;

namespace SortRig.Simulator;

/// <summary>Source-generated log messages of the simulator. Event ids 2000-2999.</summary>
internal static partial class Log
{
    [LoggerMessage(
        EventId = 2001,
        Level = LogLevel.Information,
        Message = "Simulated bench serving SCPI on tcp {Endpoint}"
    )]
    public static partial void TcpListening(this ILogger logger, string endpoint);

    [LoggerMessage(
        EventId = 2002,
        Level = LogLevel.Information,
        Message = "Simulated bench serving SCPI on serial {Path} at {Baud} Bd"
    )]
    public static partial void SerialListening(this ILogger logger, string path, int baud);

    [LoggerMessage(EventId = 2003, Level = LogLevel.Debug, Message = "Client {Client} connected")]
    public static partial void ClientConnected(this ILogger logger, string client);

    [LoggerMessage(EventId = 2004, Level = LogLevel.Debug, Message = "Client {Client} disconnected")]
    public static partial void ClientDisconnected(this ILogger logger, string client);

    [LoggerMessage(EventId = 2005, Level = LogLevel.Debug, Message = "{Client} -> {Message}")]
    public static partial void Received(this ILogger logger, string client, string message);

    [LoggerMessage(EventId = 2006, Level = LogLevel.Debug, Message = "{Client} <- {Reply}")]
    public static partial void Replied(this ILogger logger, string client, string reply);

    [LoggerMessage(EventId = 2007, Level = LogLevel.Information, Message = "Injected fault {Kind} on {Client}")]
    public static partial void FaultInjected(this ILogger logger, FaultKind kind, string client);

    [LoggerMessage(EventId = 2008, Level = LogLevel.Warning, Message = "Connection {Client} failed")]
    public static partial void ConnectionFailed(this ILogger logger, Exception exception, string client);

    [LoggerMessage(
        EventId = 2010,
        Level = LogLevel.Debug,
        Message = "Operator inserted part {Index} warmed {WarmKelvin:F1} K"
    )]
    public static partial void PartInserted(this ILogger logger, int index, double warmKelvin);

    [LoggerMessage(
        EventId = 2011,
        Level = LogLevel.Debug,
        Message = "Operator removed part {Index} (announced: {Announced})"
    )]
    public static partial void PartRemoved(this ILogger logger, int index, bool announced);

    [LoggerMessage(
        EventId = 2012,
        Level = LogLevel.Information,
        Message = "Operator finished the reel ({Count} parts)"
    )]
    public static partial void ReelFinished(this ILogger logger, int count);

    [LoggerMessage(EventId = 2013, Level = LogLevel.Information, Message = "Operator skips to reel index {Index}")]
    public static partial void SkippedTo(this ILogger logger, int index);

    [LoggerMessage(
        EventId = 2014,
        Level = LogLevel.Warning,
        Message = "Operator found part {Index} left in the fixture and took it out"
    )]
    public static partial void ForeignPartRemoved(this ILogger logger, int index);

    [LoggerMessage(EventId = 2015, Level = LogLevel.Error, Message = "Operator loop failed")]
    public static partial void OperatorFailed(this ILogger logger, Exception exception);
}
