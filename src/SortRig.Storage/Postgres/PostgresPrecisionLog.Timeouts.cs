using System.Data.Common;
using Npgsql;

namespace SortRig.Storage.Postgres;

/// <summary>Detecting a server that stopped answering: command timeout, keepalive queries, a pool emptied after an
/// outage.</summary>
internal sealed partial class PostgresPrecisionLog
{
    /// <summary>
    /// Without these a stalled link (the server or a middlebox stops forwarding, the socket stays open) hangs a write
    /// for Npgsql's default 30 s and keeps dead idle connections in the pool. The connection string's own settings win.
    /// </summary>
    private static void ApplyTimeouts(NpgsqlConnectionStringBuilder builder, string original, TimeSpan commandTimeout)
    {
        var given = new DbConnectionStringBuilder { ConnectionString = original };
        int seconds = Math.Max(1, (int)Math.Ceiling(commandTimeout.TotalSeconds));
        if (!given.ContainsKey("Command Timeout") && !given.ContainsKey("CommandTimeout"))
        {
            builder.CommandTimeout = seconds;
        }

        if (!given.ContainsKey("Timeout"))
        {
            builder.Timeout = Math.Min(builder.Timeout, Math.Max(2, seconds));
        }

        if (!given.ContainsKey("Keepalive") && !given.ContainsKey("Tcp Keepalive"))
        {
            builder.KeepAlive = Math.Max(1, seconds / 3); // an idle pooled connection to a vanished server is found out
        }

        if (!given.ContainsKey("Cancellation Timeout"))
        {
            // ms: the cancel request of a timed-out command goes through the same stalled path
            builder.CancellationTimeout = 2000;
        }
    }

    /// <summary>After an outage every pooled connection is dead; drop them so the next attempt opens a fresh
    /// one.</summary>
    private void ForgetPooledConnections() => _dataSource.Clear();
}
