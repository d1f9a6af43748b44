using Microsoft.Extensions.Logging;

namespace SortRig.Storage.Tests.Lab;

/// <summary>Keeps every log line at every level, message and exception text, to search for what must not be
/// there.</summary>
internal sealed class CapturingLoggerFactory : ILoggerFactory
{
    private readonly List<string> _lines = [];

    public IReadOnlyList<string> Lines
    {
        get
        {
            lock (_lines)
            {
                return [.. _lines];
            }
        }
    }

    public void AddProvider(ILoggerProvider provider) { }

    public ILogger CreateLogger(string categoryName) => new Capture(this, categoryName);

    public void Dispose() { }

    private sealed class Capture(CapturingLoggerFactory owner, string category) : ILogger
    {
        public IDisposable? BeginScope<TState>(TState state)
            where TState : notnull => null;

        public bool IsEnabled(LogLevel logLevel) => true;

        public void Log<TState>(
            LogLevel logLevel,
            EventId eventId,
            TState state,
            Exception? exception,
            Func<TState, Exception?, string> formatter
        )
        {
            var line = $"{logLevel} {category}: {formatter(state, exception)} {exception}";
            lock (owner._lines)
            {
                owner._lines.Add(line);
            }
        }
    }
}
