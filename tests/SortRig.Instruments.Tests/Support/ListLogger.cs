using System.Collections.Concurrent;
using Microsoft.Extensions.Logging;

namespace SortRig.Instruments.Tests.Support;

/// <summary>Keeps every log entry so tests can see what was logged at which level.</summary>
internal sealed class ListLogger : ILogger
{
    public ConcurrentQueue<(LogLevel Level, EventId Id, string Text)> Entries { get; } = new();

    public IDisposable? BeginScope<TState>(TState state)
        where TState : notnull => null;

    public bool IsEnabled(LogLevel logLevel) => true;

    public void Log<TState>(
        LogLevel logLevel,
        EventId eventId,
        TState state,
        Exception? exception,
        Func<TState, Exception?, string> formatter
    ) => Entries.Enqueue((logLevel, eventId, formatter(state, exception)));
}
