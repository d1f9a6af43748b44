using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Sorting;

// Part numbers and reel positions: a part measured again after a check takes the next number, so numbers run ahead
// of the parts fed from the reel by the number of such records.
public sealed partial class SortingLoop
{
    /// <summary>The note on a part measured again after a check, followed by the new record's number.</summary>
    internal const string RemeasuredAs = "measured again after a check as part ";

    // New record number -> reel position (0-based) of the part it measured again.
    private readonly Dictionary<int, int> _extraPositions = [];

    private int NextNumber => _partsRecorded + _extraPositions.Count + 1;

    private int ReelPosition(int number) =>
        _extraPositions.TryGetValue(number, out var position)
            ? position
            : number - 1 - _extraPositions.Keys.Count(k => k < number);

    // On resume: the records that measured flagged parts again are not reel parts. The old record names its
    // replacement (schema version 6); numbers are taken in order so each reel position is worked out against the
    // extra numbers before it.
    private void LoadExtraNumbers(IReadOnlyList<PartRecord> parts)
    {
        var byId = parts.ToDictionary(p => p.Id);
        foreach (
            var (old, number) in parts
                .Where(p => p.State == PartState.Remeasured && p.ReplacedBy is { } r && byId.ContainsKey(r))
                .Select(p => (Old: p, Number: byId[p.ReplacedBy!.Value].Number))
                .OrderBy(x => x.Number)
        )
        {
            _extraPositions[number] = ReelPosition(old.Number);
        }
    }

    // Settles one part the loop asked for (the check, or a part measured again) on the batch's range with the batch's
    // settle rule; meter faults settle it again; a part that does not settle is settled again after a word.
    private async Task<(SettleAcceptance Acceptance, IReadOnlyList<Reading> Readings)> SettleOneAsync(
        string what,
        CancellationToken ct
    )
    {
        var tracker = new SettleTracker(_ctx.Plan.Decision.Range, _ctx.Plan.Decision.Nplc, _ctx.Plan.SettleOnePart);
        var readings = new List<Reading>();
        while (true)
        {
            ct.ThrowIfCancellationRequested();
            if (await ReadAsync(ct).ConfigureAwait(false) is not { } reading)
            {
                tracker.Reset();
                readings.Clear();
                continue;
            }

            if (tracker.State is SettleState.Empty && !reading.IsFinite)
            {
                continue; // not in yet
            }

            readings.Add(reading);
            var verdict = tracker.Add(reading);
            if (verdict.State == SettleState.Accepted)
            {
                if (await VerifySetupAsync(ct).ConfigureAwait(false))
                {
                    return (verdict.Acceptance!, readings);
                }

                tracker.Reset();
                readings.Clear();
            }
            else if (verdict.State is SettleState.Unstable or SettleState.Removed)
            {
                await SayAsync($"{what} did not settle ({verdict.State}): reseat it; measuring again", ct)
                    .ConfigureAwait(false);
                tracker.Reset();
                readings.Clear();
            }
        }
    }
}
