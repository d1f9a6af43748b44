using SortRig.Planning.Assembly;
using SortRig.Planning.Cups;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>Quads (4 × 10k matched to 0.1 %) from one 1000-part reel: online cups vs the offline optimum.</summary>
internal static class YieldBench
{
    private static readonly double s_matchPpm = 1000;
    private static readonly double s_uPpm = 10;

    /// <summary>The text above the table in docs/bench-planning.md.</summary>
    public static readonly string[] Description =
    [
        "Reels of 1000 parts of 10 kOhm, stock ±1 %, expanded transfer uncertainty 10 ppm; recipe matched-quad",
        "(4 parts within 0.1 %). 'normal' and 'bimodal' as above; seeds 1–5, mean of 5 reels. Sets from cups =",
        "Σ floor(count / 4). 'K-cup bound' = most parts K disjoint 1000 ppm windows of measured values can hold on",
        "that reel, / 4 (not floored). 'worst-case K-cup bound' = the same for cups whose parts meet the recipe in",
        "the worst case, as the adaptive planner's do: a part counts only when its whole interval x ± U is in the",
        "window, and the window's edges are 1 + 0.1 % apart as a ratio; no such K-cup plan can beat it. 'fixed",
        "bands' are centred 1000 ppm bands of measured values (their cups can exceed 0.1 % in the worst case). Both",
        "bounds know the whole reel in advance; the online planner does not. 'lowest reel' is the worst of the 5",
        "reels. The offline optimum is the assembler's. Target: adaptive ≥ 98 % of the K-cup bound. 'best",
        "worst-case K-cup plan' = the most SETS K disjoint worst-case cups can give, Σ floor(count / 4) maximised",
        "over the windows (a DP that may also leave parts of a crowded window to its neighbour): what a plan that",
        "knew the reel in advance would get, counted the way cups are counted; the unfloored bounds also credit",
        "the fractions of sets in each cup that no plan can use (about 1.5 parts a cup). A check on other reels:",
        "`planning cups-seeds` (seeds 101–120, or `cups-seeds:FIRST:COUNT`; normal, bimodal, uniform and off-centre",
        "reels; not written). 'ceiling' = best worst-case K-cup plan / K-cup bound: the largest share of the K-cup",
        "bound that ANY K-cup plan whose cups meet the recipe in the worst case can reach, online or with hindsight.",
        "Why it bounds every such plan: a cup's parts have centres within the window's width less two of the reel's",
        "smallest half-widths; two cups whose centre ranges interleave can swap parts so that the lower cup keeps its",
        "count of the lowest parts and each new range lies inside an old one, so some plan of disjoint windows holds",
        "the same counts, and the DP is exact over those. Where the ceiling is below 98 % no planner can meet the",
        "target.",
        "",
    ];

    /// <summary>The planner's options on the quad; <see cref="FollowParts"/> false (a section name ending in
    /// "+fixed") measures the bands that never move under parts.</summary>
    internal static AdaptiveCupOptions Options(Recipe quad, int k) =>
        AdaptiveCupOptions.ForRecipe(quad, k, 1.0, followParts: FollowParts);

    /// <summary>False from the section name ("+fixed"): the adaptive planner's bands do not follow their
    /// parts.</summary>
    internal static bool FollowParts { get; set; } = true;

    /// <summary>The reels of the written table (seeds 1–5, normal and bimodal).</summary>
    public static List<string> Run(Recipe quad) =>
        Run(
            quad,
            [.. Enumerable.Range(1, 5)],
            [("normal", s => Reels.Normal(s, 1000)), ("bimodal", s => Reels.Bimodal(s, 1000))]
        );

    /// <summary>Seeds the written table does not use (101–120) and reel shapes it does not have; not written.</summary>
    public static List<string> RunOtherSeeds(Recipe quad, int firstSeed = 101, int seeds = 20) =>
        Run(
            quad,
            [.. Enumerable.Range(firstSeed, seeds)],
            [
                ("normal", s => Reels.Normal(s, 1000)),
                ("bimodal", s => Reels.Bimodal(s, 1000)),
                ("uniform", s => Reels.Uniform(s, 1000)),
                ("offset", s => Reels.Offset(s, 1000)),
            ],
            optimum: false
        );

    /// <summary>Debug: which part opened each cup and where (with the rejects among the first 60 parts), then the bands
    /// and counts the reel ends with.</summary>
    public static void Show(Recipe quad, string kind, int k, int seed)
    {
        var devs = kind switch
        {
            "bimodal" => Reels.Bimodal(seed, 1000),
            "uniform" => Reels.Uniform(seed, 1000),
            "offset" => Reels.Offset(seed, 1000),
            _ => Reels.Normal(seed, 1000),
        };
        var planner = new AdaptiveCupPlanner(Options(quad, k));
        var firstReject = new List<int>();
        for (var i = 0; i < devs.Count; i++)
        {
            var before = planner.Counts.Where(c => !c.IsReject && c.Count > 0).Select(c => c.CupLabel).ToHashSet();
            var d = planner.Assign(new CupRequest(i + 1, 10e3, Reels.Part(i + 1, 10e3, devs[i], s_uPpm).Value));
            if (d.IsReject && Math.Abs(devs[i]) < 10_000)
            {
                firstReject.Add(i);
                if (i < 60)
                {
                    Console.WriteLine(FormattableString.Invariant($"  part {i + 1} at {devs[i]:0} rejected"));
                }
            }

            if (!d.IsReject && !before.Contains(d.CupLabel))
            {
                var b = planner.Bands(10e3).First(x => x.Label == d.CupLabel);
                Console.WriteLine(
                    FormattableString.Invariant(
                        $"  part {i + 1} at {devs[i]:0} opens {d.CupLabel} [{b.LowPpm:0},{b.HighPpm:0}]"
                    )
                );
            }
        }

        var bound = CoverBound([.. devs], k, s_matchPpm) / 4.0;
        Console.WriteLine(
            FormattableString.Invariant(
                $"{kind} K={k} seed {seed}: sets {Sets(planner)} bound {bound} rejects {firstReject.Count}"
            )
        );
        foreach (var c in planner.Counts.OrderBy(c => c.LowPpm))
        {
            Console.WriteLine(FormattableString.Invariant($"  {c.CupLabel} [{c.LowPpm:0},{c.HighPpm:0}] {c.Count}"));
        }
    }

    private static int Sets(ICupAssigner cups) => cups.Counts.Where(c => !c.IsReject).Sum(c => c.Count / 4);

    private static List<string> Run(
        Recipe quad,
        int[] seeds,
        (string, Func<int, List<double>>)[] reels,
        bool optimum = true
    )
    {
        var rows = new List<string>
        {
            "| reel | K | fixed bands | adaptive | K-cup bound | worst-case K-cup bound | best worst-case K-cup plan "
                + "| offline optimum | adaptive / K-cup bound "
                + "| adaptive / worst-case bound | adaptive / best plan | adaptive / optimum | ≥ 98 % of bound "
                + "| ≥ 98 % of best plan | lowest reel / worst-case bound | ceiling |",
            "|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|---|",
        };
        foreach (var (name, reel) in reels)
        {
            foreach (var k in new[] { 8, 12, 20 })
            {
                double fixedSets = 0,
                    adaptive = 0,
                    bound = 0,
                    strict = 0,
                    plan = 0,
                    best = 0,
                    worst = double.MaxValue;
                foreach (var seed in seeds)
                {
                    var devs = reel(seed);
                    fixedSets += Sets(new BandCupAssigner(new BandCupOptions(k, s_matchPpm, 10e3, 1.0)), devs);
                    var a = Sets(new AdaptiveCupPlanner(Options(quad, k)), devs);
                    adaptive += a;
                    bound += CoverBound([.. devs], k, s_matchPpm) / 4.0;
                    var s = WorstCaseBound(devs, k) / 4.0;
                    strict += s;
                    plan += WorstCasePlanSets(devs, k);
                    worst = Math.Min(worst, a / s);
                    if (optimum)
                    {
                        var parts = devs.Select((d, i) => Reels.Part(i + 1, 10e3, d, s_uPpm)).ToList();
                        best += new SetAssembler().Assemble(quad, parts).Sets.Count;
                    }
                }

                var n = seeds.Length;
                var opt = optimum ? FormattableString.Invariant($"{best / n:0.0}") : "–";
                var ofOpt = optimum ? FormattableString.Invariant($"{100 * adaptive / best:0.0} %") : "–";
                rows.Add(
                    FormattableString.Invariant(
                        $"| {name} | {k} | {fixedSets / n:0.0} | {adaptive / n:0.0} | {bound / n:0.0} "
                    )
                        + FormattableString.Invariant($"| {strict / n:0.0} | {plan / n:0.0} | {opt} ")
                        + FormattableString.Invariant(
                            $"| {100 * adaptive / bound:0.0} % | {100 * adaptive / strict:0.0} % "
                        )
                        + FormattableString.Invariant($"| {100 * adaptive / plan:0.0} % | {ofOpt} ")
                        + (adaptive >= 0.98 * bound ? "| met " : "| not met ")
                        + (adaptive >= 0.98 * plan ? "| met " : "| not met ")
                        + FormattableString.Invariant($"| {100 * worst:0.0} % | {100 * plan / bound:0.0} % |")
                );
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

    /// <summary>
    /// The K-cup bound for cups whose parts meet the recipe in the worst case: a part is in a cup only when its whole
    /// interval [x − U, x + U] is, and the cup's edges may differ by the match tolerance as a ratio. On the log scale
    /// every part's centre then lies in a window of width ln(1 + tol) − 2 h (h its half-width, at least the smallest
    /// over the reel), so the point bound with that width is never below what K such cups can hold.
    /// </summary>
    internal static int WorstCaseBound(List<double> devs, int k)
    {
        static double Log(double ppm) => Math.Log(1 + (ppm * 1e-6)) * 1e6;
        var centres = devs.Select(d => (Log(d + s_uPpm) + Log(d - s_uPpm)) / 2).ToArray();
        var half = devs.Min(d => (Log(d + s_uPpm) - Log(d - s_uPpm)) / 2);
        return CoverBound(centres, k, Log(s_matchPpm) - (2 * half));
    }

    /// <summary>
    /// The most sets of four that K disjoint worst-case cups can give on the reel, Σ floor(count / 4): the windows of
    /// <see cref="WorstCaseBound"/>, each keeping a multiple of four of the parts it could hold (the rest may start
    /// the next window). DP over the sorted centres: from part i either skip it or open a window there that keeps
    /// 4q of the parts it reaches, for every q.
    /// </summary>
    internal static int WorstCasePlanSets(List<double> devs, int k)
    {
        static double Log(double ppm) => Math.Log(1 + (ppm * 1e-6)) * 1e6;
        var x = devs.Select(d => (Log(d + s_uPpm) + Log(d - s_uPpm)) / 2).Order().ToArray();
        var half = devs.Min(d => (Log(d + s_uPpm) - Log(d - s_uPpm)) / 2);
        var width = Log(s_matchPpm) - (2 * half);
        var next = Reach(x, width);
        var best = new int[x.Length + 1, k + 1];
        for (var i = x.Length - 1; i >= 0; i--)
        {
            for (var c = 1; c <= k; c++)
            {
                var b = best[i + 1, c];
                for (var q = 1; 4 * q <= next[i] - i; q++)
                {
                    b = Math.Max(b, q + best[i + (4 * q), c - 1]);
                }

                best[i, c] = b;
            }
        }

        return best[0, k];
    }

    // For each sorted point, the index of the first point at or beyond its window's end.
    private static int[] Reach(double[] x, double width)
    {
        var next = new int[x.Length];
        for (int i = 0, j = 0; i < x.Length; i++)
        {
            while (j < x.Length && x[j] < x[i] + width)
            {
                j++;
            }

            next[i] = j;
        }

        return next;
    }

    /// <summary>The K-cup bound in parts: most parts K disjoint windows of the match tolerance can hold.</summary>
    internal static int PointBound(List<double> devs, int k) => CoverBound([.. devs], k, s_matchPpm);

    /// <summary>Most points K disjoint windows of the width can hold (DP over the sorted reel).</summary>
    private static int CoverBound(double[] points, int k, double width)
    {
        var x = points.Order().ToArray();
        var next = Reach(x, width);

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
