using Microsoft.Extensions.Logging;
using SortRig.Engine.Announcing;
using SortRig.Instruments.Drivers;
using SortRig.Measurement.Readings;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    private static readonly TimeSpan s_firstBackoff = TimeSpan.FromMilliseconds(250);
    private static readonly TimeSpan s_lastBackoff = TimeSpan.FromSeconds(5);

    // One reading, or null after a fault was recovered from (the caller simply reads again).
    private async Task<Reading?> ReadAsync(CancellationToken ct)
    {
        try
        {
            _meter ??= await ConnectAsync(ct).ConfigureAwait(false);
            return await _meter.ReadAsync(ct).ConfigureAwait(false);
        }
        catch (Exception e) when (MeterFaults.IsFault(e) && !ct.IsCancellationRequested)
        {
            await RecoverAsync(e, ct).ConfigureAwait(false);
            return null;
        }
    }

    // A flaky cable, a garbled reply, a timeout or an instrument error: drop the session, open a
    // fresh one with back-off, re-apply range and NPLC, and settle the part in the fixture again.
    private async Task RecoverAsync(Exception fault, CancellationToken ct)
    {
        _faults++;
        Log.SortMeterFault(_ctx.Logger, fault.GetType().Name, fault.Message);
        await _ctx.Announcer.AnnounceAsync(Announcement.Info($"meter: {MeterFaults.Describe(fault)}; reconnecting"), ct).ConfigureAwait(false);
        if (_meter is not null)
        {
            await _meter.DisposeAsync().ConfigureAwait(false);
            _meter = null;
        }

        if (_tracker.State.IsBusy())
        {
            _tracker.Remeasure();
        }

        NoteStreamBroken();

        _meter = await ConnectWithRetryAsync(ct).ConfigureAwait(false);
    }

    // Every failed attempt is told to the operator. A setup read-back that differs (or a model
    // that does not match) may be a reply garbled on the way or a reset between the commands and
    // the read-back, so it is tried again; only when it persists is it a configuration mistake
    // that stops the session.
    private async Task<IResistanceMeter> ConnectWithRetryAsync(CancellationToken ct)
    {
        var backoff = s_firstBackoff;
        var mismatches = 0;
        while (true)
        {
            ct.ThrowIfCancellationRequested();
            try
            {
                return await ConnectAsync(ct).ConfigureAwait(false);
            }
            catch (Exception e) when (!ct.IsCancellationRequested && MeterFaults.IsRetryable(e, setupMayRetry: true))
            {
                mismatches = e is InstrumentSetupException ? mismatches + 1 : 0;
                if (mismatches > MeterFaults.SetupRetries)
                {
                    throw;
                }

                _faults++;
                Log.SortMeterFault(_ctx.Logger, e.GetType().Name, e.Message);
                await _ctx.Announcer.AnnounceAsync(
                    Announcement.Info(FormattableString.Invariant($"meter: {MeterFaults.Describe(e)}; trying again in {backoff.TotalSeconds:0.##} s")), ct).ConfigureAwait(false);
                await Task.Delay(backoff, _ctx.Time, ct).ConfigureAwait(false);
                backoff = TimeSpan.FromTicks(Math.Min(s_lastBackoff.Ticks, backoff.Ticks * 2));
            }
        }
    }
}
