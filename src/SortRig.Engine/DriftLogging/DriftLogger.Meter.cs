using Microsoft.Extensions.Logging;
using SortRig.Engine.Events;
using SortRig.Engine.Sorting;
using SortRig.Instruments.Drivers;
using SortRig.Measurement.Readings;

namespace SortRig.Engine.DriftLogging;

/// <summary>The meter side: connect, scan, verify the setup, recover from faults and keep the gap open meanwhile.</summary>
internal sealed partial class DriftLogger
{
    private static readonly TimeSpan s_firstBackoff = TimeSpan.FromMilliseconds(500);
    private static readonly TimeSpan s_lastBackoff = TimeSpan.FromSeconds(30);

    private DateTimeOffset _lastGood;
    private (DateTimeOffset From, string Reason)? _gap;

    private static TimeSpan NextBackoff(TimeSpan b) => TimeSpan.FromTicks(Math.Min(s_lastBackoff.Ticks, b.Ticks * 2));

    // One scan in scan order, or null after a fault (the meter is dropped and a gap is open).
    private async Task<IReadOnlyList<Reading>?> TryScanAsync(CancellationToken ct)
    {
        try
        {
            _meter ??= await ConnectAsync(ct).ConfigureAwait(false);
            var readings = await _meter.ReadChannelsAsync(settings.ScanOrder, ct).ConfigureAwait(false);
            if (await _meter.VerifySetupAsync(ct).ConfigureAwait(false))
            {
                return readings;
            }

            // The meter went back to its defaults during the scan: its readings are not what was asked for.
            OpenGap("meter lost its range/NPLC settings (reset?); scan discarded");
            await _meter.ConfigureAsync(settings.Setup, ct).ConfigureAwait(false);
            return null;
        }
        catch (Exception e) when (MeterFaults.IsFault(e) && !ct.IsCancellationRequested)
        {
            Log.DriftMeterFault(logger, _runId, e.GetType().Name, e.Message);
            OpenGap($"meter fault: {MeterFaults.Describe(e)}");
            await DropMeterAsync().ConfigureAwait(false);
            return null;
        }
    }

    // A first connection before the schedule starts; a fault here is met again, and handled, by the first scan.
    private async Task TryConnectAsync(CancellationToken ct)
    {
        try
        {
            _meter ??= await ConnectAsync(ct).ConfigureAwait(false);
        }
        catch (Exception e) when (MeterFaults.IsFault(e) && !ct.IsCancellationRequested)
        {
            Log.DriftMeterFault(logger, _runId, e.GetType().Name, e.Message);
        }
    }

    private async Task<IResistanceMeter> ConnectAsync(CancellationToken ct)
    {
        var meter = await connect(ct).ConfigureAwait(false);
        try
        {
            await meter.ConfigureAsync(settings.Setup, ct).ConfigureAwait(false);
            return meter;
        }
        catch
        {
            await meter.DisposeAsync().ConfigureAwait(false);
            throw;
        }
    }

    private async Task DropMeterAsync()
    {
        if (_meter is { } meter)
        {
            _meter = null;
            await meter.DisposeAsync().ConfigureAwait(false);
        }
    }

    private void OpenGap(string reason)
    {
        if (_gap is not null)
        {
            return;
        }

        _gap = (_lastGood, reason);
        hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default, State: "drift-gap",
            Text: $"drift log: {reason}; reconnecting (gap from {_lastGood:HH:mm:ss})"));
    }

    private async Task CloseGapAtEndAsync(System.Threading.Channels.ChannelWriter<DriftWrite> writer, CancellationToken storageFailed)
    {
        if (_gap is not { } gap || storageFailed.IsCancellationRequested)
        {
            return;
        }

        _gap = null;
        var to = time.GetUtcNow();
        var item = new DriftWrite(default, new Storage.Contracts.DriftGap(_runId, gap.From, to < gap.From ? gap.From : to, $"{gap.Reason}; the run ended before the meter came back"));
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
