using SortRig.Engine.Announcing;
using SortRig.Instruments.Drivers;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    // The range the meter is set to: the batch's, except while a bridging part is read on the low range.
    private double _activeRange;

    private ResistanceSetup Setup => new(_activeRange > 0 ? _activeRange : _ctx.Plan.Range, _ctx.Plan.Nplc, Options.FourWire);

    // Applies the setup now (range change for a bridging part), with the read-back; a fault reconnects,
    // and reconnecting applies the same setup.
    private async Task ApplySetupAsync(CancellationToken ct)
    {
        try
        {
            _meter ??= await ConnectWithRetryAsync(ct).ConfigureAwait(false);
            await _meter.ConfigureAsync(Setup, ct).ConfigureAwait(false);
        }
        catch (Exception e) when (MeterFaults.IsRetryable(e, setupMayRetry: true) && !ct.IsCancellationRequested)
        {
            await RecoverAsync(e, ct).ConfigureAwait(false);
        }
    }

    // Opens, identifies (once per run: the batch records the instrument) and configures a meter.
    private async Task<IResistanceMeter> ConnectAsync(CancellationToken ct)
    {
        var meter = await _ctx.ConnectAsync(ct).ConfigureAwait(false);
        try
        {
            if (_meterIdentity.Length == 0)
            {
                _meterIdentity = (await meter.IdentifyAsync(ct).ConfigureAwait(false)).ToString();
            }

            await meter.ConfigureAsync(Setup, ct).ConfigureAwait(false);
            return meter;
        }
        catch
        {
            await meter.DisposeAsync().ConfigureAwait(false);
            throw;
        }
    }

    private async Task<bool> VerifySetupAsync(CancellationToken ct)
    {
        try
        {
            if (_meter is not null && await _meter.VerifySetupAsync(ct).ConfigureAwait(false))
            {
                return true;
            }

            _faults++;
            await _ctx.Announcer.AnnounceAsync(Announcement.Info("meter lost its range/NPLC settings (reset?): re-applied, measuring again"), ct).ConfigureAwait(false);
            if (_meter is not null)
            {
                await _meter.ConfigureAsync(Setup, ct).ConfigureAwait(false);
            }

            return false;
        }
        catch (Exception e) when (MeterFaults.IsRetryable(e, setupMayRetry: true) && !ct.IsCancellationRequested)
        {
            await RecoverAsync(e, ct).ConfigureAwait(false);
            return false;
        }
    }
}
