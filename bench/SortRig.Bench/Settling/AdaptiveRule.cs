using SortRig.Measurement.Settling;
using SortRig.Measurement.Specs;

namespace SortRig.Bench.Settling;

/// <summary>The adaptive settle rule: a <see cref="SettleTracker"/> fed the free-running readings until its
/// verdict. The reel-learned prior (<see cref="SettleTracker.Prior"/>) is carried from part to part of a case, in the
/// reel's order, as the sort carries it.</summary>
internal static class AdaptiveRule
{
    private const int MaxReadings = 200_000;

    public static RuleOutcome Run(
        Insertion insertion,
        RangeSpec range,
        NplcSpec nplc,
        SettleOptions options,
        ref ReelPrior prior
    )
    {
        var tracker = new SettleTracker(range, nplc, options, prior);
        for (var k = 0; k < MaxReadings; k++)
        {
            var verdict = tracker.Add(insertion.Reading(k));
            prior = tracker.Prior;
            var seconds = insertion.Since(k).TotalSeconds;
            if (verdict is { State: SettleState.Accepted, Acceptance: { } a })
            {
                var v = a.Value;
                return RuleOutcome.Measured(
                    seconds,
                    k + 1,
                    v.Value,
                    v.ExpandedTransfer,
                    v.Expanded,
                    insertion.Truth
                ) with
                {
                    Predicted = a.AcceptedBy == SettleRule.Predictive,
                };
            }

            if (verdict.State == SettleState.Unstable)
            {
                return RuleOutcome.Unstable(seconds, k + 1);
            }
        }

        throw new InvalidOperationException($"Part {insertion.Index}: no verdict within {MaxReadings} readings.");
    }
}
