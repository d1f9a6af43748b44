using SortRig.Engine.Announcing;
using SortRig.Instruments.Drivers;
using SortRig.Measurement.Readings;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    private static readonly Backoff s_backoff = new(TimeSpan.FromMilliseconds(250), TimeSpan.FromSeconds(5));

    // One reading, or null after a fault was recovered from (the caller simply reads again).
    private async Task<Reading?> ReadAsync(CancellationToken ct)
    {
        try
        {
            var meter = await _meter.GetAsync(ct).ConfigureAwait(false);
            return await meter.ReadAsync(ct).ConfigureAwait(false);
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
        await _meter.DropAsync().ConfigureAwait(false);
        if (_tracker.State.IsBusy())
        {
            _tracker.Remeasure();
        }

        _fixture.NoteStreamBroken(_tracker.State); // the gap that follows is the fault's: excused, never a stall

        await ConnectWithRetryAsync(ct).ConfigureAwait(false);
    }

    // Every failed attempt is told to the operator; a setup read-back that keeps differing stops the session
    // (ResilientMeter.ConnectWithRetryAsync).
    private Task<IResistanceMeter> ConnectWithRetryAsync(CancellationToken ct) =>
        _meter.ConnectWithRetryAsync(s_backoff, _ctx.Time, async (e, wait, c) =>
        {
            _faults++;
            Log.SortMeterFault(_ctx.Logger, e.GetType().Name, e.Message);
            await _ctx.Announcer.AnnounceAsync(
                Announcement.Info(FormattableString.Invariant($"meter: {MeterFaults.Describe(e)}; trying again in {wait.TotalSeconds:0.##} s")), c)
                .ConfigureAwait(false);
        }, ct);
}
