using MathNet.Numerics.Distributions;
using SortRig.Planning.Cups;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>
/// Where the online cups lose sets against the worst-case K-cup bound, and what fixed bands placed from the reel's
/// true distribution (known in advance, draws unknown) would get on the same reels.
/// </summary>
internal static class CupLossBench
{
    private const double MatchPpm = 1000;
    private const double UPpm = 10;
    private const int Steps = 100;

    /// <summary>The text above the table in docs/bench-planning.md.</summary>
    public static readonly string[] Description =
    [
        "Where the adaptive planner's sets go, in sets (parts / 4), mean of the same 5 reels. 'worst-case bound'",
        "as above. 'placement' = parts the bound's best windows hold that no band of the planner's final bands",
        "(those holding parts) can hold: bands in the wrong place. 'before open' = parts of the reel that fit a",
        "final band but came before it was opened (rejected). 'remainders' = parts left in cups beyond whole sets",
        "(Σ count mod 4). 'known-distribution bands' = K disjoint worst-case bands placed once, before the first",
        "part, by the exact window DP on the reel's TRUE distribution (the generator's), then filled from the",
        "reel: what a planner that knew the distribution but not the draws gets. It is a reference, not a bound,",
        "but it shows what the K-cup bound (which picks its windows after seeing every draw) holds beyond any",
        "plan made in advance. `planning cups-write` rewrites only this section of the file.",
        "",
    ];

    /// <summary>The loss table for the written seeds (1–5), normal and bimodal.</summary>
    public static List<string> Run(Recipe quad)
    {
        var rows = new List<string>
        {
            "| reel | K | worst-case bound | adaptive | placement | before open | remainders "
                + "| known-distribution bands | adaptive / known-distribution | known-distribution / K-cup bound |",
            "|---|---|---|---|---|---|---|---|---|---|",
        };
        foreach (var kind in new[] { "normal", "bimodal" })
        {
            foreach (var k in new[] { 8, 12, 20 })
            {
                double bound = 0,
                    strict = 0,
                    sets = 0,
                    placement = 0,
                    early = 0,
                    remainders = 0,
                    known = 0;
                var oracle = KnownBands(kind, k);
                for (var seed = 1; seed <= 5; seed++)
                {
                    var devs = Reel(kind, seed);
                    var planner = new AdaptiveCupPlanner(YieldBench.Options(quad, k));
                    for (var i = 0; i < devs.Count; i++)
                    {
                        planner.Assign(new CupRequest(i + 1, 10e3, Reels.Part(i + 1, 10e3, devs[i], UPpm).Value));
                    }

                    var cups = planner.Counts.Where(c => !c.IsReject && c.Count > 0).ToList();
                    var w = YieldBench.WorstCaseBound(devs, k);
                    var fit = devs.Count(d => cups.Any(c => c.LowPpm <= d - UPpm && d + UPpm <= c.HighPpm));
                    var held = cups.Sum(c => c.Count);
                    strict += w / 4.0;
                    bound += YieldBench.PointBound(devs, k) / 4.0;
                    sets += cups.Sum(c => c.Count / 4);
                    placement += (w - fit) / 4.0;
                    early += (fit - held) / 4.0;
                    remainders += cups.Sum(c => c.Count % 4) / 4.0;
                    known += oracle.Sum(b => devs.Count(d => b.Lo <= d - UPpm && d + UPpm <= b.Hi) / 4);
                }

                rows.Add(
                    FormattableString.Invariant(
                        $"| {kind} | {k} | {strict / 5:0.0} | {sets / 5:0.0} | {placement / 5:0.0} | {early / 5:0.0} "
                    )
                        + FormattableString.Invariant(
                            $"| {remainders / 5:0.0} | {known / 5:0.0} | {100 * sets / known:0.0} % "
                        )
                        + FormattableString.Invariant($"| {100 * known / bound:0.0} % |")
                );
            }
        }

        return rows;
    }

    private static List<double> Reel(string kind, int seed) =>
        kind == "bimodal" ? Reels.Bimodal(seed, 1000) : Reels.Normal(seed, 1000);

    /// <summary>
    /// K disjoint worst-case bands (edges 1 + tolerance apart as a ratio, a part in only when x ± U is inside) that
    /// hold the most probability of the reel's generator, on a grid of a hundredth of a band.
    /// </summary>
    private static List<(double Lo, double Hi)> KnownBands(string kind, int k)
    {
        static double Log(double ppm) => Math.Log(1 + (ppm * 1e-6)) * 1e6;
        static double Ppm(double y) => (Math.Exp(y * 1e-6) - 1) * 1e6;
        var width = Log(MatchPpm) - 1e-3;
        var step = width / Steps;
        var first = Log(-Reels.StockPpm) - width;
        var points = (int)Math.Ceiling((Log(Reels.StockPpm) - first) / step) + 1;
        var gains = new double[points];
        for (var j = 0; j < points; j++)
        {
            var lo = Ppm(first + (j * step));
            var hi = Ppm(first + (j * step) + width);
            gains[j] = Mass(kind, lo + UPpm, hi - UPpm);
        }

        var starts = WindowCover.Best(gains, Steps, [.. gains.Select(_ => true)], k).Starts;
        return [.. starts.Select(j => (Ppm(first + (j * step)), Ppm(first + (j * step) + width)))];
    }

    // Probability that a part of the generator (Reels.Normal or Reels.Bimodal) lies in [a, b] ppm.
    private static double Mass(string kind, double a, double b)
    {
        if (b <= a)
        {
            return 0;
        }

        var (sigma, gap) = kind == "bimodal" ? (Reels.StockPpm / 2, 0.4 * Reels.StockPpm) : (Reels.StockPpm / 3, 0);
        double Part(double lo, double hi) => hi > lo ? Normal.CDF(0, sigma, hi) - Normal.CDF(0, sigma, lo) : 0;
        var max = Reels.StockPpm;
        var total = Part(-max, -gap) + Part(gap, max);
        return (Part(Math.Max(a, -max), Math.Min(b, -gap)) + Part(Math.Max(a, gap), Math.Min(b, max))) / total;
    }
}
