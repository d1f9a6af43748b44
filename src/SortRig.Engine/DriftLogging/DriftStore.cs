using System.Threading.Channels;
using Microsoft.Extensions.Logging;
using SortRig.Engine.Durability;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.DriftLogging;

/// <summary>
/// The single reader of the logger's bounded channel: appends samples to the log in batches of at most
/// BatchSize (one transaction each, fewer when it keeps up), writes gaps in order, and retries a
/// locked or unreachable store with back-off. Memory is bounded by the channel and one batch: while the store is
/// down the channel fills, the logger waits on it and marks the scans it could not take as a gap.
/// A locked store is given up after 8 attempts; an unreachable one (a lab server restarting, a stalled link) is
/// retried for up to <see cref="MaxOutage"/> of bench time, then the run stops with the fault.
/// </summary>
internal sealed class DriftStore(IDriftLog log, int batchSize, long runId, TimeProvider time, ILogger logger)
{
    private const int MaxAttempts = 8;

    /// <summary>Longest outage of an unreachable server the run waits out: 1 h of bench time.</summary>
    public static readonly TimeSpan MaxOutage = TimeSpan.FromHours(1);
    private readonly List<StoredDriftSample> _batch = new(batchSize);

    /// <summary>New sample rows written so far.</summary>
    public long Stored { get; private set; }

    /// <summary>Gaps written so far.</summary>
    public int Gaps { get; private set; }

    /// <summary>Drains the channel until its writer completes; every item read is written before it returns.</summary>
    public async Task RunAsync(ChannelReader<DriftWrite> reader, CancellationToken ct)
    {
        while (await reader.WaitToReadAsync(ct).ConfigureAwait(false))
        {
            while (_batch.Count < batchSize && reader.TryRead(out var item))
            {
                if (item.Gap is { } gap)
                {
                    await FlushAsync(ct).ConfigureAwait(false);
                    await RetryAsync(c => log.MarkGapAsync(gap, c), ct).ConfigureAwait(false);
                    Gaps++;
                    Log.DriftGapMarked(logger, runId, gap.From, gap.To, gap.Reason);
                }
                else
                {
                    _batch.Add(item.Sample);
                }
            }

            await FlushAsync(ct).ConfigureAwait(false);
        }
    }

    private async Task FlushAsync(CancellationToken ct)
    {
        if (_batch.Count == 0)
        {
            return;
        }

        // A retried append after an unknown outcome is safe: the log ignores samples it already has.
        var added = 0;
        await RetryAsync(async c => added = await log.AppendDriftSamplesAsync(_batch, c).ConfigureAwait(false), ct)
            .ConfigureAwait(false);
        Stored += added;
        _batch.Clear();
    }

    private async Task RetryAsync(Func<CancellationToken, Task> write, CancellationToken ct)
    {
        var delay = TimeSpan.FromMilliseconds(500);
        var firstFailure = (DateTimeOffset?)null;
        for (var attempt = 1; ; attempt++)
        {
            try
            {
                await write(ct).ConfigureAwait(false);
                return;
            }
            catch (StorageException e)
                when (StorageFaultRule.ClearsByItself(e.Fault)
                    && WaitOut(e.Fault, attempt, firstFailure ??= time.GetUtcNow())
                )
            {
                Log.DriftStorageRetry(logger, runId, e.Fault.ToString(), e.Message, delay.TotalSeconds);
                await Task.Delay(delay, time, ct).ConfigureAwait(false);
                delay = TimeSpan.FromTicks(Math.Min(delay.Ticks * 2, TimeSpan.FromSeconds(30).Ticks));
            }
        }
    }

    private bool WaitOut(StorageFault fault, int attempt, DateTimeOffset firstFailure) =>
        fault == StorageFault.Unavailable ? time.GetUtcNow() - firstFailure < MaxOutage : attempt < MaxAttempts;
}
