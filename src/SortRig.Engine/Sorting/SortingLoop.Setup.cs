using SortRig.Engine.Announcing;
using SortRig.Instruments.Drivers;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    // The range the meter is set to: the batch's (0), except while a bridging part is read on another range.
    private double _activeRange;

    private ResistanceSetup Setup =>
        new(_activeRange > 0 ? _activeRange : _ctx.Plan.Range, _ctx.Plan.Nplc, Options.FourWire);

    // Every later (re)connection applies the new range too.
    private void SetActiveRange(double range)
    {
        _activeRange = range;
        _meter.Setup = Setup;
    }

    // Applies the setup now (range change for a bridging part), with the read-back; a fault reconnects,
    // and reconnecting applies the same setup.
    private async Task ApplySetupAsync(CancellationToken ct)
    {
        try
        {
            var meter = await ConnectWithRetryAsync(ct).ConfigureAwait(false);
            await meter.ConfigureAsync(Setup, ct).ConfigureAwait(false);
        }
        catch (Exception e) when (MeterFaults.IsRetryable(e, setupMayRetry: true) && !ct.IsCancellationRequested)
        {
            await RecoverAsync(e, ct).ConfigureAwait(false);
        }
    }

    private async Task<bool> VerifySetupAsync(CancellationToken ct)
    {
        try
        {
            if (await _meter.VerifyAsync(ct).ConfigureAwait(false))
            {
                return true;
            }

            _faults++;
            await _ctx
                .Announcer.AnnounceAsync(
                    Announcement.Info("meter lost its range/NPLC settings (reset?): re-applied, measuring again"),
                    ct
                )
                .ConfigureAwait(false);
            await _meter.ApplyAsync(ct).ConfigureAwait(false);
            return false;
        }
        catch (Exception e) when (MeterFaults.IsRetryable(e, setupMayRetry: true) && !ct.IsCancellationRequested)
        {
            await RecoverAsync(e, ct).ConfigureAwait(false);
            return false;
        }
    }
}
