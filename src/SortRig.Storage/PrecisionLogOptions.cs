using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;

namespace SortRig.Storage;

/// <summary>Options of a precision log. Each property is checked when set.</summary>
public sealed class PrecisionLogOptions
{
    private readonly TimeSpan _busyTimeout = TimeSpan.FromSeconds(5);
    private readonly int _transientRetries = 5;
    private readonly TimeSpan _commandTimeout = TimeSpan.FromSeconds(15);

    /// <summary>Clock for the times the log stamps itself (session start, history, drift run start). Default: system
    /// clock.</summary>
    public TimeProvider TimeProvider { get; init; } = TimeProvider.System;

    /// <summary>Where log messages go. Default: nowhere.</summary>
    public ILoggerFactory LoggerFactory { get; init; } = NullLoggerFactory.Instance;

    /// <summary>
    /// How long a write waits for a lock held by another writer before failing with StorageFault.Locked:
    /// SQLite busy_timeout, PostgreSQL lock_timeout. Default 5 s; valid 1 s .. 10 min (SQLite rounds up to whole
    /// seconds for its command retry).
    /// </summary>
    public TimeSpan BusyTimeout
    {
        get => _busyTimeout;
        init =>
            _busyTimeout =
                value >= TimeSpan.FromSeconds(1) && value <= TimeSpan.FromMinutes(10)
                    ? value
                    : throw new ArgumentOutOfRangeException(
                        nameof(BusyTimeout),
                        value,
                        "BusyTimeout must be between 1 s and 10 min."
                    );
    }

    /// <summary>
    /// How often a write is retried after a transient conflict (PostgreSQL serialization failure or deadlock).
    /// Default 5; valid 0 .. 50.
    /// </summary>
    public int TransientRetries
    {
        get => _transientRetries;
        init =>
            _transientRetries = value is >= 0 and <= 50
                ? value
                : throw new ArgumentOutOfRangeException(
                    nameof(TransientRetries),
                    value,
                    "TransientRetries must be between 0 and 50."
                );
    }

    /// <summary>
    /// PostgreSQL only: how long one command may wait for the server before the connection is taken for dead
    /// (Npgsql Command Timeout; an idle connection sends a keepalive query every third of it, at least 1 s), so a
    /// server that stops answering (a stalled link, a hung host) becomes StorageFault.Unavailable instead of a hang.
    /// Used when the connection string sets no Command Timeout / Keepalive of its own. Default 15 s; valid 1 s .. 10
    /// min; must exceed the longest single write (a drift batch of 5 000 samples takes well under a second on a lab
    /// server).
    /// </summary>
    public TimeSpan CommandTimeout
    {
        get => _commandTimeout;
        init =>
            _commandTimeout =
                value >= TimeSpan.FromSeconds(1) && value <= TimeSpan.FromMinutes(10)
                    ? value
                    : throw new ArgumentOutOfRangeException(
                        nameof(CommandTimeout),
                        value,
                        "CommandTimeout must be between 1 s and 10 min."
                    );
    }

    /// <summary>Test hook: SQLite max_page_count, to provoke a real "database or disk is full" (SQLITE_FULL).</summary>
    internal long? SqliteMaxPageCount { get; init; }
}
