using System.Globalization;
using SortRig.Engine.Announcing;
using SortRig.Engine.Sorting;
using SortRig.Measurement.Ranging;
using SortRig.Planning.Cups;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Typed;

internal sealed partial class TypedSortingLoop
{
    /// <summary>A typed meter has no integration time; the log's batch and parts carry this placeholder.</summary>
    internal const double TypedNplc = 1;

    // Opens or resumes the session as the hands-free loop does: numbering and cups continue from the log, and a part
    // committed but never announced is announced again first.
    private async Task OpenSessionAsync(CancellationToken ct)
    {
        var state = await DurablyAsync(
                "the session",
                c =>
                    _ctx.Log.OpenOrResumeSessionAsync(
                        new SessionRequest(Options.Session, ReopenFinished: Options.Reopen),
                        c
                    ),
                ct
            )
            .ConfigureAwait(false);
        _session = state.Session;
        _batch = state.CurrentBatch;
        var parts = await _ctx.Log.GetPartsAsync(_session.Id, ct).ConfigureAwait(false);
        _partsRecorded = parts.Count;
        _lastLive = parts.Where(p => p.IsLive).OrderBy(p => p.Number).LastOrDefault();
        _ctx.Cups.Restore(
            parts
                .Where(p => p.IsLive && (p.CupLabel ?? p.SlotLabel) is not null)
                .Select(p => (new CupRequest(p.Number, p.Nominal, p.Measured), (p.CupLabel ?? p.SlotLabel)!))
                .ToList()
        );
        foreach (var p in parts)
        {
            _ctx.Snapshot.Upsert(ToView(p));
        }

        // The page knows the session at once; the range follows once the operator has set it.
        _ctx.Snapshot.SetSession(
            new SessionView(
                _session.Name,
                _session.Id,
                Options.Nominal,
                Options.StockTolerance,
                Options.MatchTolerance,
                MeterIdentity,
                "range not set yet",
                TypedNplc,
                Options.Parts,
                false,
                false
            )
        );
        PublishCounts();
        if (state.Resumed)
        {
            await SayAsync($"resuming session '{_session.Name}' at part {state.NextPartNumber}", ct)
                .ConfigureAwait(false);
        }

        foreach (var p in state.Unannounced.OrderBy(p => p.Number))
        {
            await AnnounceStoredAsync(p, AnnouncementKind.Repeat, completesSet: false, ct).ConfigureAwait(false);
        }
    }

    // The range rule names the range; the operator sets it by hand and confirms it (Enter) or types the one set.
    // A range that would overflow is refused; a lost digit or a coarse digit is told and accepted.
    private async Task<bool> ChooseRangeAsync(CancellationToken ct)
    {
        var request = new HandRangeRequest(Options.Nominal, Options.StockTolerance, Options.MatchTolerance);
        var recommended = HandRangeRule.Choose(_ctx.Meter, request);
        await SayAsync($"{OhmsText(Options.Nominal)} parts: {recommended.Instruction}", ct).ConfigureAwait(false);
        var prompt =
            $"range set on the meter: press Enter for {recommended.Recommended.Name}, or type the range you set";
        while (true)
        {
            var line = await _ctx.Entries.AskAsync(prompt, ct).ConfigureAwait(false);
            if (line is null)
            {
                _inputEnded = true;
                return false;
            }

            var selected = line.Trim().Length == 0 ? recommended.Recommended : FindRange(line.Trim());
            if (selected is null)
            {
                prompt =
                    $"'{line.Trim()}' is not a range of {_ctx.Meter.Family} ("
                    + $"{string.Join(", ", _ctx.Meter.Ranges.Select(r => r.Name))}): type the range you set, or "
                    + $"Enter for {recommended.Recommended.Name}";
                continue;
            }

            var decision = HandRangeRule.Check(_ctx.Meter, request, selected);
            foreach (var w in decision.Warnings)
            {
                await SayAsync(w.Text, ct).ConfigureAwait(false);
            }

            if (!decision.Usable)
            {
                prompt =
                    $"set another range: press Enter for {recommended.Recommended.Name}, or type the range you set";
                continue;
            }

            _range = selected;
            await StartBatchAsync(ct).ConfigureAwait(false);
            await SayAsync(
                    $"ready: {OhmsText(Options.Nominal)} on the {_range.Name} range; put part {_partsRecorded + 1} "
                        + $"in the fixture and read the display",
                    ct
                )
                .ConfigureAwait(false);
            return true;
        }
    }

    private Measurement.Specs.DisplayRange? FindRange(string text)
    {
        var t = text.Replace(" ", "", StringComparison.Ordinal);
        foreach (var unit in (string[])["ohms", "ohm", "Ω"])
        {
            if (t.EndsWith(unit, StringComparison.OrdinalIgnoreCase))
            {
                t = t[..^unit.Length];
            }
        }

        var scale =
            t.Length == 0
                ? 1
                : t[^1] switch
                {
                    'k' or 'K' => 1e3,
                    'M' or 'm' => 1e6,
                    'R' or 'r' => 1,
                    _ => 0,
                };
        var digits = scale == 0 ? t : t[..^1];
        return double.TryParse(digits, NumberStyles.AllowDecimalPoint, CultureInfo.InvariantCulture, out var x)
            ? _ctx.Meter.Find(x * (scale == 0 ? 1 : scale))
            : null;
    }

    private async Task StartBatchAsync(CancellationToken ct)
    {
        var setup = new BatchSetup(
            Options.Nominal,
            Options.StockTolerance * 1e6,
            Options.MatchTolerance * 1e6,
            _range.FullScale,
            TypedNplc,
            Options.FourWire,
            _ctx.Meter.Family,
            MeterIdentity
        );
        if (
            _batch is not { } b
            || b.Setup.Nominal != setup.Nominal
            || b.Setup.Range != setup.Range
            || b.Setup.MatchTolerancePpm != setup.MatchTolerancePpm
            || b.Setup.StockTolerancePpm != setup.StockTolerancePpm
            || b.Setup.MeterFamily != setup.MeterFamily
        )
        {
            _batch = await DurablyAsync("the batch", c => _ctx.Log.StartBatchAsync(_session.Id, setup, c), ct)
                .ConfigureAwait(false);
        }

        _ctx.Snapshot.SetSession(
            new SessionView(
                _session.Name,
                _session.Id,
                Options.Nominal,
                Options.StockTolerance,
                Options.MatchTolerance,
                setup.MeterIdentity,
                _range.Name,
                TypedNplc,
                Options.Parts,
                false,
                false
            )
        );
    }

    private string MeterIdentity => $"typed by hand ({_ctx.Meter.Family})";

    private Task SayAsync(string text, CancellationToken ct) =>
        _ctx.Announcer.AnnounceAsync(Announcement.Info(text), ct).AsTask();

    private static string OhmsText(double ohms) => Measurement.Readings.OhmsText.Nominal(ohms);
}
