using System.Threading.Channels;
using Microsoft.Extensions.Logging;
using SortRig.Engine.Events;
using SortRig.Instruments.Drivers;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.DriftLogging;

/// <summary>
/// The overnight drift job: every interval it reads the part channels, bracketed by two Pt100 readings,
/// converts the Pt100 by Callendar-Van Dusen, and hands the samples over a bounded channel (single
/// reader, back-pressure, never dropping) to <see cref="DriftStore"/>, which appends them in batches.
/// Meter faults are recovered by reconnecting with back-off on the injected clock; the stretch without
/// samples is marked as a gap from the last good sample to the first good one after it.
/// </summary>
internal sealed partial class DriftLogger(
    DriftSettings settings,
    Func<CancellationToken, Task<IResistanceMeter>> connect,
    IPrecisionLog log,
    BenchEventHub hub,
    TimeProvider time,
    ILogger logger
)
{
    private readonly ResilientMeter _meter = new(connect, settings.Setup, identify: false);
    private long _runId;
    private long _scans;
    private long _skipped;
    private long _overloads;

    /// <summary>Runs until the duration has passed or <paramref name="ct"/> is cancelled, then analyses the
    /// run.</summary>
    /// <returns>The outcome; also after cancellation (everything read by then is stored).</returns>
    public async Task<DriftOutcome> RunAsync(CancellationToken ct)
    {
        var labels = settings
            .Channels.Select(c => new DriftChannel(
                DriftSettings.PartLabel(c),
                settings.LibraryParts.TryGetValue(c, out var part) ? part : null
            ))
            .ToList();
        if (settings.Pt100Channel is { } pt)
        {
            labels.Add(new DriftChannel(DriftSettings.Pt100Label(pt)));
        }

        var run = await log.StartDriftRunAsync(
                new DriftRunRequest(settings.RunName, labels, settings.Interval, settings.Notes),
                ct
            )
            .ConfigureAwait(false);
        _runId = run.Id;
        Log.DriftStarted(logger, run.Id, run.Name, labels.Count, settings.Interval.TotalSeconds);
        var queue = Channel.CreateBounded<DriftWrite>(
            new BoundedChannelOptions(settings.BatchSize * 4)
            {
                FullMode = BoundedChannelFullMode.Wait,
                SingleReader = true,
                SingleWriter = true,
            }
        );
        var store = new DriftStore(log, settings.BatchSize, run.Id, time, logger);
        using var storageFailed = new CancellationTokenSource();
        using var measuring = CancellationTokenSource.CreateLinkedTokenSource(ct, storageFailed.Token);
        var storing = StoreAsync(store, queue.Reader, storageFailed);
        try
        {
            await MeasureAsync(queue.Writer, measuring.Token).ConfigureAwait(false);
        }
        catch (OperationCanceledException) when (measuring.IsCancellationRequested)
        {
            // Stopped by the caller (an open-ended run ends this way) or by a storage failure, rethrown below.
        }
        finally
        {
            await CloseGapAtEndAsync(queue.Writer, storageFailed.Token).ConfigureAwait(false);
            queue.Writer.TryComplete();
            await _meter.DropAsync().ConfigureAwait(false);
        }

        await storing.ConfigureAwait(false);
        if (_skipped > 0)
        {
            Log.DriftSkippedTicks(logger, run.Id, _skipped);
        }

        Log.DriftFinished(logger, run.Id, _scans, store.Stored, store.Gaps);
        var channels = await DriftRunAnalysis.AnalyzeAsync(log, run.Id, CancellationToken.None).ConfigureAwait(false);
        return new DriftOutcome(run.Id, _scans, store.Stored, store.Gaps, _skipped, _overloads, channels);
    }

    private static async Task StoreAsync(
        DriftStore store,
        ChannelReader<DriftWrite> reader,
        CancellationTokenSource failed
    )
    {
        try
        {
            // Not the caller's token: what was read is written even when the run is being stopped.
            await store.RunAsync(reader, CancellationToken.None).ConfigureAwait(false);
        }
        catch
        {
            await failed.CancelAsync().ConfigureAwait(false);
            throw;
        }
    }

    private async Task MeasureAsync(ChannelWriter<DriftWrite> writer, CancellationToken ct)
    {
        var interval = settings.Interval;
        await TryConnectAsync(ct).ConfigureAwait(false); // the schedule starts once the meter is set up
        var start = time.GetUtcNow();
        var end = settings.Duration is { } d ? start + d : DateTimeOffset.MaxValue;
        _lastGood = start;
        var backoff = s_backoff.First;
        for (long tick = 0; ; )
        {
            var due = start + TimeSpan.FromTicks(interval.Ticks * tick);
            if (due >= end)
            {
                return;
            }

            var wait = due - time.GetUtcNow();
            if (wait > TimeSpan.Zero)
            {
                await Task.Delay(wait, time, ct).ConfigureAwait(false);
            }

            while (true)
            {
                var readings = await TryScanAsync(ct).ConfigureAwait(false);
                if (readings is not null)
                {
                    await RecordAsync(readings, writer, ct).ConfigureAwait(false);
                    backoff = s_backoff.First;
                    break;
                }

                // Retry within this interval while the back-off ends before the next scan is due.
                var retryAt = time.GetUtcNow() + backoff;
                if (retryAt >= due + interval || retryAt >= end)
                {
                    backoff = s_backoff.Next(backoff);
                    break;
                }

                await Task.Delay(backoff, time, ct).ConfigureAwait(false);
                backoff = s_backoff.Next(backoff);
            }

            var elapsed = (time.GetUtcNow() - start).Ticks;
            var next = Math.Max(tick + 1, (elapsed + interval.Ticks - 1) / interval.Ticks);
            _skipped += next - tick - 1;
            tick = next;
        }
    }
}
