using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using SortRig.Planning.Cups;
using static SortRig.Planning.Tests.Cups.CupAssignerContractTests;
using static SortRig.Planning.Tests.Cups.CupTestReels;

namespace SortRig.Planning.Tests.Cups;

/// <summary>
/// The adaptive planner with <see cref="AdaptiveCupOptions.FollowParts"/>: bands that hold parts may move, but every
/// cup's parts must still form a matched set in the worst case, and a restart must replay to the same state.
/// </summary>
public sealed class AdaptiveCupFollowTests
{
    private static readonly Dictionary<double, int> s_quad = new() { [10e3] = 4 };

    // Referee, brute force: a cup's parts are a matched set in the worst case when some window [L, L (1 + tol)] holds
    // every part's whole interval [value − U, value + U]; if any window does, the one starting at the lowest interval
    // end does, so every part's low end is tried as L (common practice for matched sets, no source).
    private static bool FitOneWindow(List<(double Value, double U)> parts, double tolPpm) =>
        parts.Any(start =>
        {
            var lo = start.Value - start.U;
            var hi = lo * (1 + (tolPpm * 1e-6));
            return parts.All(p => p.Value - p.U >= lo && p.Value + p.U <= hi);
        });

    private sealed record Run(
        Dictionary<string, List<(double Value, double U)>> ByCup,
        List<(CupRequest Part, string Label)> History,
        int Moves,
        string? Broken
    );

    // Sorts the reel, checking after every part that each cup's parts lie inside the band the planner names for it.
    private static Run Sort(AdaptiveCupPlanner planner, List<(double Ppm, double U)> reel)
    {
        var byCup = new Dictionary<string, List<(double Value, double U)>>();
        var history = new List<(CupRequest, string)>();
        var edges = new Dictionary<string, (double, double)>();
        var moves = 0;
        for (var i = 0; i < reel.Count; i++)
        {
            var part = Part(i + 1, 10e3, reel[i].Ppm, reel[i].U);
            var d = planner.Assign(part);
            history.Add((part, d.CupLabel));
            if (!d.IsReject)
            {
                var cup = byCup.TryGetValue(d.CupLabel, out var l) ? l : byCup[d.CupLabel] = [];
                cup.Add((part.Value.Value, part.Value.ExpandedTransfer));
            }

            foreach (var (label, lo, hi) in planner.Bands(10e3).Where(b => byCup.ContainsKey(b.Label)))
            {
                if (edges.TryGetValue(label, out var was) && was != (lo, hi))
                {
                    moves++;
                }

                edges[label] = (lo, hi);
                var (a, b) = (10e3 * (1 + (lo * 1e-6)), 10e3 * (1 + (hi * 1e-6)));
                var outside = byCup[label].FirstOrDefault(p => p.Value - p.U < a - 1e-9 || p.Value + p.U > b + 1e-9);
                if (outside != default)
                {
                    return new Run(
                        byCup,
                        history,
                        moves,
                        $"after part {i + 1} cup {label} [{lo}, {hi}] ppm " + $"does not hold its part {outside}"
                    );
                }
            }
        }

        return new Run(byCup, history, moves, null);
    }

    [Property(MaxTest = 60)]
    public Property EveryCup_IsAMatchedSetInTheWorstCase_AndLiesInItsNamedBand(
        PositiveInt seed,
        byte shape,
        byte cups,
        byte tolerance,
        bool tiny
    )
    {
        var k = 1 + (cups % (tiny ? 4 : 23));
        var tolPpm = 200 + (tolerance * 8);
        var reel = Reel(seed.Get, shape % 4, tiny ? 12 : 300, uMax: tolPpm / 10);
        var options = new AdaptiveCupOptions(k, tolPpm, 1.0, s_quad, learnCount: tiny ? 4 : 20, followParts: true);
        var planner = new AdaptiveCupPlanner(options);

        var run = Sort(planner, reel);

        if (run.Broken is not null)
        {
            return false.Label(run.Broken);
        }

        if (run.ByCup.FirstOrDefault(c => !FitOneWindow(c.Value, tolPpm)) is { Key: not null } bad)
        {
            return false.Label($"cup {bad.Key}: no window of {tolPpm} ppm holds its parts");
        }

        // No part in two cups or lost: the planner's counts are the decisions, cup by cup.
        var counts = planner.Counts.Where(c => !c.IsReject && c.Count > 0).ToDictionary(c => c.CupLabel, c => c.Count);
        var decided = run.ByCup.ToDictionary(c => c.Key, c => c.Value.Count);
        var rejects = planner.Counts.Where(c => c.IsReject).Sum(c => c.Count);
        return (
            counts.Count == decided.Count
            && decided.All(c => counts.GetValueOrDefault(c.Key) == c.Value)
            && decided.Values.Sum() + rejects == reel.Count
            && planner.Bands(10e3).All(b => (((1 + (b.HighPpm * 1e-6)) / (1 + (b.LowPpm * 1e-6))) - 1) * 1e6 <= tolPpm)
        ).Label("counts differ from the decisions, or a band is wider than the tolerance");
    }

    [Fact]
    public void BimodalReel_BandsHoldingPartsMove_AndStillHoldTheirParts()
    {
        // A reel with its centre binned out: the first parts open bands before the hole shows, so following the parts
        // must move some band that holds parts (else the checks above prove nothing about moved bands).
        var reel = Reel(5, 1, 1000, uMax: 10);
        var planner = new AdaptiveCupPlanner(new AdaptiveCupOptions(8, 1000, 1.0, s_quad, followParts: true));

        var run = Sort(planner, reel);

        Assert.Null(run.Broken);
        Assert.True(run.Moves > 0, "no band that held parts moved");
        Assert.All(run.ByCup, c => Assert.True(FitOneWindow(c.Value, 1000), $"cup {c.Key}"));
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    public void Restore_ReproducesCountsBandsAndTheNextDecision(int shape)
    {
        var options = new AdaptiveCupOptions(8, 1000, 1.0, s_quad, learnCount: 30, followParts: true);
        var first = new AdaptiveCupPlanner(options);
        var run = Sort(first, Reel(31 + shape, shape, 400, uMax: 10));

        var second = new AdaptiveCupPlanner(options);
        second.Restore(run.History);

        Assert.Equal(first.Counts, second.Counts);
        Assert.Equal(first.Bands(10e3), second.Bands(10e3));
        foreach (var (n, ppm) in new[] { (1001L, 4321.0), (1002L, -150.0), (1003L, -6020.0) })
        {
            Assert.Equal(first.Assign(Part(n, 10e3, ppm)), second.Assign(Part(n, 10e3, ppm)));
        }
    }

    [Fact]
    public void PartAcrossTheBandsEdge_GoesIn_WhenTheCupsPartsLeaveRoom_AndTheBandMovesToHoldIt()
    {
        var planner = new AdaptiveCupPlanner(new AdaptiveCupOptions(4, 1000, 1.0, s_quad, learnCount: 4));
        var first = planner.Assign(Part(1, 10e3, 300, uPpm: 10));
        var band = planner.Bands(10e3).Single(b => b.Label == first.CupLabel);
        // 5 ppm inside the upper edge with 10 ppm of uncertainty: 5 ppm past the band, well within one band of part 1.
        var edge = planner.Assign(Part(2, 10e3, band.HighPpm - 5, uPpm: 10));
        Assert.Equal(first.CupLabel, edge.CupLabel);
        // The cup's band (wherever the plan put it) holds both parts' whole intervals.
        var moved = planner.Bands(10e3).Single(b => b.Label == first.CupLabel);
        Assert.True(moved.HighPpm >= band.HighPpm + 5 && moved.LowPpm <= 290, $"{band} -> {moved}");
        Assert.True((((1 + (moved.HighPpm * 1e-6)) / (1 + (moved.LowPpm * 1e-6))) - 1) * 1e6 <= 1000, $"{moved}");
        // A part that the cup's parts leave no room for (its interval and part 1's more than a band apart) does not go
        // in.
        var far = planner.Assign(Part(3, 10e3, 300 - 1000, uPpm: 10));
        Assert.NotEqual(first.CupLabel, far.CupLabel);
    }
}
