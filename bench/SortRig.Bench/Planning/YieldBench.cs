using SortRig.Planning.Assembly;
using SortRig.Planning.Cups;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>Quads (4 × 10k matched to 0.1 %) from one 1000-part reel: online cups vs the offline optimum.</summary>
internal static class YieldBench
{
    private static readonly double s_matchPpm = 1000;
    private static readonly double s_uPpm = 10;
    private static readonly int s_seeds = 5;

    public static List<string> Run(Recipe quad)
    {
        var rows = new List<string>
        {
            "| reel | K | fixed bands | adaptive | K-cup bound | offline optimum | adaptive / K-cup bound | adaptive / optimum | ≥ 98 % of bound |",
            "|---|---|---|---|---|---|---|---|---|",
        };
        foreach (var (name, reel) in new (string, Func<int, List<double>>)[] { ("normal", s => Reels.Normal(s, 1000)), ("bimodal", s => Reels.Bimodal(s, 1000)) })
        {
            foreach (var k in new[] { 8, 12, 20 })
            {
                double fixedSets = 0, adaptive = 0, bound = 0, optimum = 0;
                for (var seed = 1; seed <= s_seeds; seed++)
                {
                    var devs = reel(seed);
                    fixedSets += Sets(new BandCupAssigner(new BandCupOptions(k, s_matchPpm, 10e3, 1.0)), devs);
                    adaptive += Sets(new AdaptiveCupPlanner(AdaptiveCupOptions.ForRecipe(quad, k, 1.0)), devs);
                    bound += CoverBound(devs, k, s_matchPpm) / 4;
                    var parts = devs.Select((d, i) => Reels.Part(i + 1, 10e3, d, s_uPpm)).ToList();
                    optimum += new SetAssembler().Assemble(quad, parts).Sets.Count;
                }

                rows.Add(FormattableString.Invariant(
                    $"| {name} | {k} | {fixedSets / s_seeds:0.0} | {adaptive / s_seeds:0.0} | {bound / s_seeds:0.0} | {optimum / s_seeds:0.0} | {100 * adaptive / bound:0.0} % | {100 * adaptive / optimum:0.0} % | {(adaptive >= 0.98 * bound ? "met" : "not met")} |"));
            }
        }

        return rows;
    }

    private static int Sets(ICupAssigner cups, List<double> devs)
    {
        for (var i = 0; i < devs.Count; i++)
        {
            cups.Assign(new CupRequest(i + 1, 10e3, Reels.Part(i + 1, 10e3, devs[i], s_uPpm).Value));
        }

        return cups.Counts.Where(c => !c.IsReject).Sum(c => c.Count / 4);
    }

    /// <summary>Most parts any K disjoint windows of the match width can hold (DP over the sorted reel): no K-cup plan beats count/4.</summary>
    private static int CoverBound(List<double> devs, int k, double width)
    {
        var x = devs.Order().ToArray();
        var next = new int[x.Length];
        for (int i = 0, j = 0; i < x.Length; i++)
        {
            while (j < x.Length && x[j] < x[i] + width)
            {
                j++;
            }

            next[i] = j;
        }

        var best = new int[x.Length + 1, k + 1];
        for (var i = x.Length - 1; i >= 0; i--)
        {
            for (var c = 1; c <= k; c++)
            {
                best[i, c] = Math.Max(best[i + 1, c], next[i] - i + best[next[i], c - 1]);
            }
        }

        return best[0, k];
    }
}
