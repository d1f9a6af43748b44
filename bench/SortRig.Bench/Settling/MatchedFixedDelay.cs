using SortRig.Measurement.Specs;

namespace SortRig.Bench.Settling;

/// <summary>
/// The accuracy-matched fixed delay: every insertion is also judged by the fixed-delay rule at each delay of a grid
/// (0.5 s steps up to 40 s); the matched delay is the shortest one whose share of values outside 2 × target is at
/// most <see cref="MaxShare"/> (0.1 %) over the reel. Speed is then compared at equal accuracy.
/// </summary>
internal sealed class MatchedFixedDelay(RangeSpec range, NplcSpec nplc)
{
    public const double MaxShare = 0.001;
    public static readonly TimeSpan Step = TimeSpan.FromSeconds(0.5);
    public const int Steps = 80;
    private readonly List<RuleOutcome[]> _outcomes = [];

    public void Add(Insertion insertion) =>
        _outcomes.Add([
            .. Enumerable
                .Range(1, Steps)
                .Select(k => FixedDelayRule.Run(insertion, range, nplc, fourWire: true, Step * k)),
        ]);

    /// <summary>The matched delay and its outcomes, or the longest delay (and null delay) when none
    /// qualifies.</summary>
    public (TimeSpan? Delay, IReadOnlyList<RuleOutcome> Outcomes) Match(double targetPpm)
    {
        for (var k = 0; k < Steps; k++)
        {
            var outcomes = _outcomes.Select(o => o[k]).ToList();
            var outside = outcomes.Count(o => !o.Accepted || Math.Abs(o.ErrorPpm) > 2 * targetPpm);
            if (outside <= MaxShare * outcomes.Count)
            {
                return (Step * (k + 1), outcomes);
            }
        }

        return (null, _outcomes.Select(o => o[^1]).ToList());
    }
}
