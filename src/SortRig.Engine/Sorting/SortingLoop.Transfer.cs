using System.Globalization;
using SortRig.Engine.Announcing;
using SortRig.Measurement.Ranging;
using SortRig.Measurement.Uncertainty;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

public sealed partial class SortingLoop
{
    // Puts values read on this batch's range onto the session's first range; null when none applies.
    private RangeCorrection? _correction;

    // Then onto the check's scale when the session re-referenced to its check standard after a shift.
    private MeasuredValue OnReferenceScale(MeasuredValue value)
    {
        var onRange = _correction is { } c && c.FromRangeFullScale == _ctx.Plan.Range ? c.Apply(value) : value;
        return _checkScale == 1
            ? onRange
            : onRange with
            {
                Value = onRange.Value * _checkScale,
                StandardUncertainty = onRange.StandardUncertainty * _checkScale,
                TransferUncertainty = onRange.TransferUncertainty * _checkScale,
            };
    }

    // A batch on another range than the session's first batch: plan the transfer between the two ranges
    // (docs/range-transfer.md) and put this batch's values on the first batch's scale, from above (2R after R)
    // or from below (R after 2R). A transfer already recorded on this batch is applied, never measured again.
    private async Task PrepareRangeTransferAsync(IReadOnlyList<BatchInfo> batches, CancellationToken ct)
    {
        if (_batch.RangeTransfer is { } recorded)
        {
            _correction = new RangeCorrection(
                1 + (recorded.CorrectionPpm * 1e-6),
                recorded.StandardUncertaintyPpm * 1e-6,
                recorded.ToRange,
                recorded.FromRange
            );
            await SayAsync(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"range transfer already recorded for this batch: values on the {recorded.FromRange:G6} Ohm "
                            + $"range corrected by {recorded.CorrectionPpm:+0.0;-0.0} ppm (u = "
                            + $"{recorded.StandardUncertaintyPpm:0.0} ppm)"
                    ),
                    ct
                )
                .ConfigureAwait(false);
            return;
        }

        var first = batches.Count > 0 ? batches[0] : null;
        if (first is null || first.Id == _batch.Id || first.Setup.Range == _ctx.Plan.Range)
        {
            return; // single-range session so far: nothing changes
        }

        RangeTransfer transfer;
        try
        {
            var earlier = first.Setup;
            var plan = RangeRule.Plan(
                _ctx.Plan.Meter,
                [
                    new RangeRequest(
                        earlier.Nominal,
                        earlier.StockTolerancePpm * 1e-6,
                        earlier.MatchTolerancePpm * 1e-6,
                        _ctx.Plan.Nplc,
                        Options.FourWire
                    ),
                    _ctx.Plan.Decision.Request,
                ]
            );
            transfer = plan.Transfers.Single();
        }
        catch (Exception e) when (e is ArgumentException or InvalidOperationException)
        {
            await SayAsync(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"range transfer cannot be planned ({e.Message}); values on this range are not corrected"
                    ),
                    ct
                )
                .ConfigureAwait(false);
            return;
        }

        var needed = !transfer.UncorrectedResolvable;
        var gainPpm = transfer.CoverageFactor * transfer.GainUncertainty * 1e6;
        var allowedPpm = transfer.AllowedRelative * 1e6;
        if (Options.Bridge == BridgeMode.Off || (Options.Bridge == BridgeMode.Auto && !needed))
        {
            var why = needed ? "the match band needs one, but range transfer is off" : "the match band allows it";
            await SayAsync(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"ratios to the {first.Setup.Range:G6} Ohm range batch carry up to ±{gainPpm:0} ppm of range "
                            + $"gain error (allowed {allowedPpm:0} ppm), not corrected: {why}"
                    ),
                    ct
                )
                .ConfigureAwait(false);
            return;
        }

        await CarryOutTransferAsync(transfer, gainPpm, ct).ConfigureAwait(false);
    }

    private async Task CarryOutTransferAsync(RangeTransfer transfer, double gainPpm, CancellationToken ct)
    {
        // The bridging part is the largest nominal on the low range: the earlier batch's when this batch is on
        // the high range (2R after R), this batch's own when it is on the low one (R after 2R).
        var bridge = transfer.BridgeNominal;
        var ontoLow = transfer.HighRange.FullScale == _ctx.Plan.Range;
        var whose = ontoLow ? "from the earlier batch" : "of this batch";
        await SayAsync(
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"range transfer: the {transfer.HighRange.FullScale:G6} Ohm range may read up to ±{gainPpm:0} "
                        + $"ppm off the {transfer.LowRange.FullScale:G6} Ohm range. Put one {bridge:G6} Ohm part "
                        + $"{whose} in the fixture as a bridging part (it is not stored)"
                ),
                ct
            )
            .ConfigureAwait(false);
        await _ctx.Hands.PlaceBridgingPartAsync(bridge, ct).ConfigureAwait(false);
        RangeCorrection correction;
        while (true)
        {
            var onLow = await SettleBridgeAsync(transfer.LowRange, bridge, thermallySettled: false, ct)
                .ConfigureAwait(false);
            var onHigh = await SettleBridgeAsync(transfer.HighRange, bridge, thermallySettled: true, ct)
                .ConfigureAwait(false);
            try
            {
                var highOntoLow = transfer.Correction(onLow, onHigh);
                correction = ontoLow ? highOntoLow : highOntoLow.Inverted();
                break;
            }
            catch (ArgumentException e)
            {
                await SayAsync(
                        string.Create(
                            CultureInfo.InvariantCulture,
                            $"bridging part: {e.Message} Leave one part in the fixture; measuring it again"
                        ),
                        ct
                    )
                    .ConfigureAwait(false);
            }
        }

        var ppm = (correction.Factor - 1) * 1e6;
        var uPpm = correction.RelativeStandardUncertainty * 1e6;
        CrashPoint.Pass(CrashSite.Bridge);
        var record = new RangeTransferCorrection(
            correction.FromRangeFullScale,
            correction.ToRangeFullScale,
            ppm,
            uPpm,
            _ctx.Time.GetUtcNow()
        );
        _batch = await DurablyAsync(
                "the range transfer",
                c => _ctx.Log.RecordRangeTransferAsync(_batch.Id, record, c),
                ct
            )
            .ConfigureAwait(false);
        _correction = correction;
        CrashPoint.Pass(CrashSite.Bridged);
        await SayAsync(
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"range transfer recorded: values on the {correction.FromRangeFullScale:G6} Ohm range corrected "
                        + $"by {ppm:+0.0;-0.0} ppm onto the {correction.ToRangeFullScale:G6} Ohm range (u = {uPpm:0.0} "
                        + $"ppm, U = {2 * uPpm:0.0} ppm at k = 2). Take the bridging part out"
                ),
                ct
            )
            .ConfigureAwait(false);
        _ctx.Hands.RemoveBridgingPart();
        await WaitForBridgeRemovalAsync(ct).ConfigureAwait(false);
        SetActiveRange(0); // the batch's own range from here on
        if (!ontoLow)
        {
            await ApplySetupAsync(ct).ConfigureAwait(false); // the bridge was read on the high range last
        }
    }

    private ValueTask SayAsync(string text, CancellationToken ct) =>
        _ctx.Announcer.AnnounceAsync(Announcement.Info(text), ct);
}
