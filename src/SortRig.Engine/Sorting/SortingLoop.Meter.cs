using SortRig.Engine.Announcing;
using SortRig.Instruments.Drivers;
using SortRig.Instruments.Scpi;
using SortRig.Measurement.Readings;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    private static readonly Backoff s_backoff = new(TimeSpan.FromMilliseconds(250), TimeSpan.FromSeconds(5));

    // Replies that were not a reading, in a row: each waits longer, and too many stop the session.
    private readonly UnreadableStreak _unreadable = new(s_backoff);

    // One reading, or null after a fault was recovered from (the caller simply reads again).
    private async Task<Reading?> ReadAsync(CancellationToken ct)
    {
        try
        {
            var meter = await _meter.GetAsync(ct).ConfigureAwait(false);
            var reading = await meter.ReadAsync(ct).ConfigureAwait(false);
            _unreadable.Reset();
            return reading;
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

        // A reply that is not a reading (the link is fine): wait longer each time; the limit stops the session.
        var wait = fault is ScpiResponseException reply ? _unreadable.Note(reply) : TimeSpan.Zero;
        await _ctx
            .Announcer.AnnounceAsync(
                Announcement.Info(
                    wait > TimeSpan.Zero
                        ? string.Create(
                            System.Globalization.CultureInfo.InvariantCulture,
                            $"meter: {MeterFaults.Describe(fault)}; reading again in {wait.TotalSeconds:0.##} s ("
                                + $"{_unreadable.Count} of {_unreadable.Limit} in a row)"
                        )
                        : $"meter: {MeterFaults.Describe(fault)}; reconnecting"
                ),
                ct
            )
            .ConfigureAwait(false);
        await _meter.DropAsync().ConfigureAwait(false);
        if (_tracker.State.IsBusy())
        {
            _tracker.Remeasure();
        }

        _fixture.NoteStreamBroken(_tracker.State); // the gap that follows is the fault's: excused, never a stall

        await Task.Delay(wait, _ctx.Time, ct).ConfigureAwait(false);
        await ConnectWithRetryAsync(ct).ConfigureAwait(false);
    }

    // Every failed attempt is told to the operator; a setup read-back that keeps differing stops the session
    // (ResilientMeter.ConnectWithRetryAsync).
    private Task<IResistanceMeter> ConnectWithRetryAsync(CancellationToken ct) =>
        _meter.ConnectWithRetryAsync(
            s_backoff,
            _ctx.Time,
            async (e, wait, c) =>
            {
                _faults++;
                Log.SortMeterFault(_ctx.Logger, e.GetType().Name, e.Message);
                await _ctx
                    .Announcer.AnnounceAsync(
                        Announcement.Info(
                            FormattableString.Invariant(
                                $"meter: {MeterFaults.Describe(e)}; trying again in {wait.TotalSeconds:0.##} s"
                            )
                        ),
                        c
                    )
                    .ConfigureAwait(false);
            },
            ct
        );
}
