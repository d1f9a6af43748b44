using System.Globalization;
using SortRig.Engine.Checking;
using SortRig.Measurement.Control;
using SortRig.Measurement.Settling;
using SortRig.Measurement.Uncertainty;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

// The check standard (docs/checking.md): read at the start, on its cadence between parts and at the end; judged on an
// individuals chart whose limits come from the check's own history; a point out of control pauses the session and
// flags the parts measured since the last good check.
public sealed partial class SortingLoop
{
    private const int CheckHistoryKept = 30;
    private readonly List<double> _checkBaseline = [];
    private readonly List<double> _checkPoints = [];
    private CheckSource? _check;
    private CheckSchedule _checkSchedule = new(0, TimeSpan.Zero);
    private ChartLimits? _checkLimits;
    private double _checkScale = 1;
    private int _partsAtLastCheck;
    private DateTimeOffset _lastCheckAt;

    private bool CheckDue =>
        _check is not null
        && _tracker.State == SettleState.Empty
        && _checkSchedule.Due(_partsRecorded - _partsAtLastCheck, _ctx.Time.GetUtcNow() - _lastCheckAt);

    private async Task PrepareCheckAsync(CancellationToken ct)
    {
        if (string.IsNullOrWhiteSpace(Options.Check))
        {
            return;
        }

        var source = CheckSource.Parse(Options.Check, Options.CheckValue);
        if (source.Kind == CheckSourceKind.Library)
        {
            var part = await _ctx.Log.GetPartAsync(source.LibraryPartId!.Value, ct).ConfigureAwait(false)
                ?? throw new SortPlanException($"--check: the log has no part {source.LibraryPartId}.", []);
            source = source with { Nominal = part.Nominal, CalibratedOhms = source.CalibratedOhms ?? part.Value };
        }

        _check = source;
        _checkSchedule = new CheckSchedule(Options.CheckEvery, TimeSpan.FromMinutes(Options.CheckMinutes));
        var history = await _ctx.Log.GetCheckHistoryAsync(source.Name, CheckHistoryKept, ct).ConfigureAwait(false);
        _checkBaseline.AddRange(history.Where(c => c.Commit.InControl).Select(c => c.Commit.ScaledOhms));

        // A resumed session keeps the scale of its last re-reference: the factor is stored with every check record.
        var mine = await _ctx.Log.GetSessionChecksAsync(_session.Id, ct).ConfigureAwait(false);
        if (mine.Count > 0)
        {
            _checkScale = mine[^1].Commit.ScaleFactor;
        }
        if (_checkBaseline.Count >= Options.CheckBaseline)
        {
            SetCheckLimits();
        }
    }

    private void SetCheckLimits()
    {
        var kept = _checkBaseline.TakeLast(CheckHistoryKept).ToArray();
        var floor = Options.CheckSigmaFloorPpm * 1e-6 * kept.Average();
        _checkLimits = ChartLimits.FromHistory(kept, floor);
        _checkPoints.Clear();
    }

    // One check: while the history is short, the check is re-seated and read until the limits can be set (those
    // readings are the baseline); then one reading judged on the chart. At the start of a resumed session a check in
    // control is followed by the offer of any parts an earlier check flagged.
    private async Task RunCheckAsync(string when, bool resumeFeeding, bool atStart, CancellationToken ct)
    {
        var check = _check!;
        while (_checkLimits is null)
        {
            var (raw, at) = await ReadCheckAsync(when, ct).ConfigureAwait(false);
            _checkBaseline.Add(raw.Value * _checkScale);
            await RecordCheckAsync(check, raw, at, null, "Baseline", null, ct).ConfigureAwait(false);
            if (_checkBaseline.Count >= Options.CheckBaseline)
            {
                SetCheckLimits();
                double centre = _checkLimits!.Centre,
                    sigmaPpm = _checkLimits.Sigma / centre * 1e6;
                int n = _checkBaseline.Count;
                await SayAsync($"check limits set: {n} readings, centre {centre:F4} Ohm, sigma {sigmaPpm:0.0} ppm", ct)
                    .ConfigureAwait(false);
                FinishCheck(resumeFeeding);
                return;
            }
        }

        var (value, time) = await ReadCheckAsync(when, ct).ConfigureAwait(false);
        _checkPoints.Add(value.Value * _checkScale);
        var verdict = ControlChart.Judge(_checkLimits, _checkPoints);
        var record = await RecordCheckAsync(
                check,
                value,
                time,
                verdict,
                verdict.Rule.ToString(),
                verdict.InControl ? null : verdict.Reason,
                ct
            )
            .ConfigureAwait(false);
        if (verdict.InControl)
        {
            await SayAsync($"check {record.Seq} in control ({verdict.SigmaScore:+0.0;-0.0} sigma)", ct)
                .ConfigureAwait(false);
            if (atStart)
            {
                await OfferWaitingFlaggedAsync(ct).ConfigureAwait(false);
            }
        }
        else
        {
            await OutOfControlAsync(record, verdict, ct).ConfigureAwait(false);
        }

        FinishCheck(resumeFeeding);
    }

    private void FinishCheck(bool resumeFeeding)
    {
        _partsAtLastCheck = _partsRecorded;
        _lastCheckAt = _ctx.Time.GetUtcNow();
        _fixture.NoteStreamBroken(_tracker.State); // the gap the check made is excused, never a stall
        if (resumeFeeding)
        {
            _ctx.Hands.ResumeAt(_partsRecorded);
        }
    }

    private async Task<CheckRecord> RecordCheckAsync(
        CheckSource check,
        MeasuredValue raw,
        DateTimeOffset at,
        ControlVerdict? verdict,
        string rule,
        string? reason,
        CancellationToken ct
    )
    {
        CrashPoint.Pass(CrashSite.Check);
        var commit = new CheckCommit(
            Guid.NewGuid(),
            _session.Id,
            check.Name,
            at,
            raw.Value,
            _ctx.Plan.Range,
            raw.StandardUncertainty,
            check.CalibratedOhms,
            _checkLimits?.Centre,
            _checkLimits?.Sigma,
            verdict?.InControl ?? true,
            rule,
            reason,
            _checkScale
        );
        var record = await DurablyAsync("the check", c => _ctx.Log.RecordCheckAsync(commit, c), ct)
            .ConfigureAwait(false);
        CrashPoint.Pass(CrashSite.Checked);
        var suspects = await _ctx.Log.GetSuspectPartsAsync(_session.Id, ct).ConfigureAwait(false);
        _ctx.Snapshot.SetCheck(
            new CheckView(
                check.Name,
                record.Seq,
                at,
                commit.ScaledOhms,
                verdict?.SigmaScore ?? 0,
                commit.InControl,
                reason ?? "",
                suspects.Count,
                record.GainPpm
            )
        );
        return record;
    }

    // Puts the check in the fixture, settles it on the batch's range, takes it out again.
    private async Task<(MeasuredValue Value, DateTimeOffset At)> ReadCheckAsync(string when, CancellationToken ct)
    {
        var check = _check!;
        await SayAsync(
                $"check ({when}): put the check standard {check.Name} ({check.Nominal:G6} Ohm) in the fixture",
                ct
            )
            .ConfigureAwait(false);
        await _ctx.Hands.PlaceCheckPartAsync(check.Nominal, ct).ConfigureAwait(false);
        var (acceptance, _) = await SettleOneAsync("the check standard", ct).ConfigureAwait(false);
        var value = acceptance.Value;
        await SayAsync($"check read {value.Value * _checkScale:F4} Ohm: take the check standard out", ct)
            .ConfigureAwait(false);
        _ctx.Hands.RemoveBridgingPart();
        await WaitForBridgeRemovalAsync(ct).ConfigureAwait(false);
        return (value, acceptance.Readings[^1].Time);
    }
}
