using Microsoft.Extensions.Logging;
using SortRig.Engine.Events;
using SortRig.Engine.Sorting;
using SortRig.Instruments.Drivers;
using SortRig.Measurement.Readings;

namespace SortRig.Engine.DriftLogging;

/// <summary>The meter side: connect, scan, verify the setup, recover from faults and keep the gap open
/// meanwhile.</summary>
internal sealed partial class DriftLogger
{
    private static readonly Backoff s_backoff = new(TimeSpan.FromMilliseconds(500), TimeSpan.FromSeconds(30));

    private DateTimeOffset _lastGood;
    private (DateTimeOffset From, string Reason)? _gap;

    // One scan in scan order, or null after a fault (the meter is dropped and a gap is open).
    private async Task<IReadOnlyList<Reading>?> TryScanAsync(CancellationToken ct)
    {
        try
        {
            var meter = await _meter.GetAsync(ct).ConfigureAwait(false);
            var readings = await meter.ReadChannelsAsync(settings.ScanOrder, ct).ConfigureAwait(false);
            if (await meter.VerifySetupAsync(ct).ConfigureAwait(false))
            {
                return readings;
            }

            // The meter went back to its defaults during the scan: its readings are not what was asked for.
            OpenGap("meter lost its range/NPLC settings (reset?); scan discarded");
            await meter.ConfigureAsync(settings.Setup, ct).ConfigureAwait(false);
            return null;
        }
        catch (Exception e) when (MeterFaults.IsFault(e) && !ct.IsCancellationRequested)
        {
            Log.DriftMeterFault(logger, _runId, e.GetType().Name, e.Message);
            OpenGap($"meter fault: {MeterFaults.Describe(e)}");
            await _meter.DropAsync().ConfigureAwait(false);
            return null;
        }
    }

    // A first connection before the schedule starts; a fault here is met again, and handled, by the first scan.
    private async Task TryConnectAsync(CancellationToken ct)
    {
        try
        {
            await _meter.GetAsync(ct).ConfigureAwait(false);
        }
        catch (Exception e) when (MeterFaults.IsFault(e) && !ct.IsCancellationRequested)
        {
            Log.DriftMeterFault(logger, _runId, e.GetType().Name, e.Message);
        }
    }

    private void OpenGap(string reason)
    {
        if (_gap is not null)
        {
            return;
        }

        _gap = (_lastGood, reason);
        hub.Publish(
            new BenchEvent(
                0,
                BenchEventKind.Notice,
                default,
                State: "drift-gap",
                Text: $"drift log: {reason}; reconnecting (gap from {_lastGood:HH:mm:ss})"
            )
        );
    }

    private async Task CloseGapAtEndAsync(
        System.Threading.Channels.ChannelWriter<DriftWrite> writer,
        CancellationToken storageFailed
    )
    {
        if (_gap is not { } gap || storageFailed.IsCancellationRequested)
        {
            return;
        }

        _gap = null;
        var to = time.GetUtcNow();
        var item = new DriftWrite(
            default,
            new Storage.Contracts.DriftGap(
                _runId,
                gap.From,
                to < gap.From ? gap.From : to,
                $"{gap.Reason}; the run ended before the meter came back"
            )
        );
        try
        {
            await writer.WriteAsync(item, storageFailed).ConfigureAwait(false);
        }
        catch (OperationCanceledException)
        {
            // The store failed; its exception is what the caller sees.
        }
    }
}
