using System.Globalization;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Specs;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    // Sets the meter to the range and settles the bridging part there, with the batch's settle rule
    // (the target no finer than half a display step at the bridge value). Once the part has cooled on
    // the first range (thermallySettled), the second range judges the window alone: the fitted-span
    // criterion would read the higher range's larger noise at the bridge value as residual cooling.
    // Meter faults reconnect and settle again; a part that does not settle is settled again after a word.
    private async Task<MeasuredValue> SettleBridgeAsync(
        RangeSpec range,
        double bridgeNominal,
        bool thermallySettled,
        CancellationToken ct
    )
    {
        SetActiveRange(range.FullScale);
        await ApplySetupAsync(ct).ConfigureAwait(false);
        var nplc = _ctx.Plan.Decision.Nplc;
        var settle = _ctx.Plan.SettleOnePart;
        var halfStepPpm = nplc.Resolution(range.FullScale) / 2 / bridgeNominal * 1e6;
        if (settle.Target.Unit == SettleTargetUnit.Ppm && settle.Target.Value < halfStepPpm)
        {
            settle = settle with { Target = SettleTarget.Ppm(halfStepPpm) };
        }

        if (thermallySettled)
        {
            settle = settle with { SettlingSpan = TimeSpan.Zero };
        }

        var tracker = new SettleTracker(range, nplc, settle);
        while (true)
        {
            ct.ThrowIfCancellationRequested();
            if (await ReadAsync(ct).ConfigureAwait(false) is not { } reading)
            {
                tracker.Reset(); // a fault broke the stream: settle again from the next reading
                continue;
            }

            if (reading.Range != 0 && Math.Abs(reading.Range - range.FullScale) > 1e-9 * range.FullScale)
            {
                continue; // a reading taken before the range change
            }

            var verdict = tracker.Add(reading);
            if (verdict.State == SettleState.Accepted)
            {
                if (await VerifySetupAsync(ct).ConfigureAwait(false))
                {
                    return verdict.Acceptance!.Value;
                }

                tracker.Reset();
            }
            else if (verdict.State == SettleState.Unstable)
            {
                await SayAsync(
                        string.Create(
                            CultureInfo.InvariantCulture,
                            $"bridging part not settling on the {range.FullScale:G6} Ohm range ("
                                + $"{verdict.Failure!.Reason}): reseat it; measuring again"
                        ),
                        ct
                    )
                    .ConfigureAwait(false);
                tracker.Reset();
            }
        }
    }

    // The bridging part must be out before the batch's first part: wait for the removal overloads.
    private async Task WaitForBridgeRemovalAsync(CancellationToken ct)
    {
        var overloads = 0;
        while (overloads < _ctx.Plan.Settle.RemovalOverloads)
        {
            ct.ThrowIfCancellationRequested();
            overloads = await ReadAsync(ct).ConfigureAwait(false) is { } r && !r.IsFinite ? overloads + 1 : 0;
        }
    }
}
