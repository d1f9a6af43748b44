using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using SortRig.Planning.Cups;
using static SortRig.Planning.Tests.Cups.CupAssignerContractTests;
using static SortRig.Planning.Tests.Cups.CupTestReels;

namespace SortRig.Planning.Tests.Cups;

/// <summary>
/// The adaptive planner's cups hold matched parts in the worst case; with fixed bands (FollowParts off) bands never
/// move under parts. The default, bands that follow their parts, is checked in <see cref="AdaptiveCupFollowTests"/>.
/// </summary>
public sealed class AdaptiveCupWorstCaseTests
{
    private static readonly Dictionary<double, int> s_quad = new() { [10e3] = 4 };

    [Property(MaxTest = 60)]
    public Property EveryCup_MeetsTheMatchToleranceInTheWorstCase_AndNoBandMovesUnderParts(
        PositiveInt seed,
        byte shape,
        byte cups,
        byte tolerance
    )
    {
        var k = 1 + (cups % 23);
        var tolPpm = 200 + (tolerance * 8);
        var reel = Reel(seed.Get, shape % 4, 300, uMax: tolPpm / 10);
        var options = new AdaptiveCupOptions(k, tolPpm, 1.0, s_quad, learnCount: 20, followParts: false);
        var planner = new AdaptiveCupPlanner(options);
        var byCup = new Dictionary<string, List<(double Value, double U)>>();
        var edges = new Dictionary<string, (double, double)>();
        for (var i = 0; i < reel.Count; i++)
        {
            var part = Part(i + 1, 10e3, reel[i].Ppm, reel[i].U);
            var d = planner.Assign(part);
            if (!d.IsReject)
            {
                var cup = byCup.TryGetValue(d.CupLabel, out var l) ? l : byCup[d.CupLabel] = [];
                cup.Add((part.Value.Value, part.Value.ExpandedTransfer));
            }

            // A band that holds parts keeps its edges for the rest of the reel.
            foreach (var (label, lo, hi) in planner.Bands(10e3).Where(b => byCup.ContainsKey(b.Label)))
            {
                if (edges.TryGetValue(label, out var was) && was != (lo, hi))
                {
                    return false.Label($"band {label} moved from {was} to ({lo}, {hi}) after part {i + 1}");
                }

                edges[label] = (lo, hi);
            }
        }

        // Worst case of the matched rule: every part at the edge of its expanded uncertainty, ratio of the highest to
        // the lowest value within 1 + tolerance (common practice for matched sets, no source).
        foreach (var (label, parts) in byCup)
        {
            var worst = ((parts.Max(p => p.Value + p.U) / parts.Min(p => p.Value - p.U)) - 1) * 1e6;
            if (worst > tolPpm)
            {
                return false.Label($"cup {label}: worst-case spread {worst} ppm > {tolPpm} ppm");
            }
        }

        // Every band named is no wider than the tolerance as a ratio of its edges.
        return planner
            .Bands(10e3)
            .All(b => (((1 + (b.HighPpm * 1e-6)) / (1 + (b.LowPpm * 1e-6))) - 1) * 1e6 <= tolPpm)
            .Label("a band is wider than the tolerance");
    }

    [Fact]
    public void PartAtTheEdgeOfABand_WithItsUncertaintyOutside_DoesNotGoIn()
    {
        var options = new AdaptiveCupOptions(4, 1000, 1.0, s_quad, learnCount: 4, followParts: false);
        var planner = new AdaptiveCupPlanner(options);
        var first = planner.Assign(Part(1, 10e3, 300, uPpm: 10));
        var band = planner.Bands(10e3).Single(b => b.Label == first.CupLabel);
        // 5 ppm inside the upper edge with 10 ppm of uncertainty: its worst case reaches past the band.
        var edge = planner.Assign(Part(2, 10e3, band.HighPpm - 5, uPpm: 10));
        Assert.NotEqual(first.CupLabel, edge.CupLabel);
        var inside = planner.Assign(Part(3, 10e3, band.HighPpm - 15, uPpm: 10));
        Assert.Equal(first.CupLabel, inside.CupLabel);
    }
}
