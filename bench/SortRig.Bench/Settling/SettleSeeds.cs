using System.Diagnostics;
using System.Globalization;
using SortRig.Instruments.Profiles;
using SortRig.Measurement.Settling;

namespace SortRig.Bench.Settling;

/// <summary>
/// `settle-seeds [parts] [seeds]`: the predictive rule alone (no oracle, no fixed-delay search) on <c>seeds</c> reels
/// of <c>parts</c> per benchmark case, each reel on a seed that is not the benchmark's, the reel prior carried part to
/// part as the sort carries it. Reports per case and pooled: insertions, values outside 2 × target with the one-sided
/// 95 % Clopper-Pearson bound, mean seconds a part, and where each miss fell (part index, learning phase or learned
/// range, rule that accepted, fit model); the same pooled with the benchmark's own reel (its overview table in
/// docs/bench-settle.md). Writes docs/bench-settle.md between its own markers. The false-accept bound is a property of
/// the rule, so it is shown on many reels, not one.
/// </summary>
internal static class SettleSeeds
{
    public const string Begin = "<!-- settle-seeds:begin (written by `settle-seeds`) -->";
    public const string End = "<!-- settle-seeds:end -->";

    /// <summary>Seeds of the extra reels: far from the benchmark's (2026-2033) and the diagnosis seeds named in
    /// docs/bench-settle.md (2030-8030), one block of 1 000 per reel index, the case index inside it.</summary>
    private const int SeedBase = 100_000;

    public static async Task<int> RunAsync(string[] args, CancellationToken ct)
    {
        var parts = args.Length > 1 && int.TryParse(args[1], out var p) ? p : 1_000;
        var seeds = args.Length > 2 && int.TryParse(args[2], out var s) ? s : 10;
        var root = RepositoryRoot.Find();
        var docs = Path.Combine(root, "docs", "bench-settle.md");
        var profile = MeterProfileLoader.Load(Path.Combine(root, "instruments", "simulator.yaml"));
        var range = profile.FindRange(SettleCase.Range)!;
        var options = SettleCase.SortOptions() with { Predictive = SettleCase.Predictive };
        var cases = SettleCase.All(parts, [("predictive", options)]);
        var jobs = cases.SelectMany((c, i) => Enumerable.Range(0, seeds).Select(r => (Case: i, Reel: r))).ToList();
        var reels = new ReelRun[jobs.Count];
        var clock = Stopwatch.StartNew();

        // Two reels at a time: the machine has two cores, shared.
        Parallel.For(0, jobs.Count, new ParallelOptions { MaxDegreeOfParallelism = 2, CancellationToken = ct }, j =>
        {
            var (ci, r) = jobs[j];
            var c = cases[ci] with { Seed = SeedBase + (1_000 * r) + ci };
            reels[j] = RunReel(c, range, profile.FindNplc(c.Nplc)!, options, ct);
            Console.WriteLine(
                FormattableString.Invariant(
                    $"{c.Name} seed {c.Seed}: {reels[j].Misses.Count} / {reels[j].Accepted} outside 2 x target, "
                )
                    + FormattableString.Invariant(
                        $"mean {reels[j].Seconds / reels[j].Accepted:0.00} s ({clock.Elapsed.TotalSeconds:0} s)"
                    )
            );
        });

        var benchmark = BenchmarkCounts(await File.ReadAllTextAsync(docs, ct).ConfigureAwait(false));
        var lines = Table(cases, reels, jobs, benchmark, parts, seeds, clock.Elapsed.TotalSeconds);
        foreach (var line in lines)
        {
            Console.WriteLine(line);
        }

        await ResultsTable.ReplaceBlockAsync(docs, Begin, End, lines, ct).ConfigureAwait(false);
        return 0;
    }

    /// <summary>One reel: the predictive rule on every part in the reel's order.</summary>
    private static ReelRun RunReel(
        SettleCase c,
        Measurement.Specs.RangeSpec range,
        Measurement.Specs.NplcSpec nplc,
        SettleOptions options,
        CancellationToken ct
    )
    {
        var source = new InsertionSource(c.Reel, c.Physics, c.Seed, range.FullScale, c.Nplc);
        var prior = ReelPrior.Empty;
        var run = new ReelRun(c.Seed);
        foreach (var ins in source.Insertions())
        {
            ct.ThrowIfCancellationRequested();
            var learning = prior.BodyRange is null;
            var tracker = new SettleTracker(range, nplc, options, prior);
            for (var k = 0; k < 200_000; k++)
            {
                var verdict = tracker.Add(ins.Reading(k));
                if (verdict.State == SettleState.Unstable)
                {
                    run.Unstable++;
                    break;
                }

                if (verdict is not { State: SettleState.Accepted, Acceptance: { } a })
                {
                    continue;
                }

                prior = tracker.Prior;
                var seconds = ins.Since(k).TotalSeconds;
                var predicted = a.AcceptedBy == SettleRule.Predictive;
                run.Accepted++;
                run.Seconds += seconds;
                run.Predicted += predicted ? 1 : 0;
                run.Learning += learning ? 1 : 0;
                var err = (a.Value.Value - ins.Truth) / ins.Truth * 1e6;
                if (Math.Abs(err) > 2 * SettleCase.TargetPpm)
                {
                    run.Misses.Add(
                        new Miss(
                            c.Seed,
                            ins.Index,
                            err,
                            seconds,
                            learning,
                            predicted ? a.Fit : null,
                            a.Fit is { } f ? f.StandardUncertainty / ins.Truth * 1e6 : double.NaN
                        )
                    );
                }

                break;
            }
        }

        run.LearnedFrom = prior.BodyRange is null ? -1 : prior.Count;
        return run;
    }

    private static List<string> Table(
        IReadOnlyList<SettleCase> cases,
        ReelRun[] reels,
        List<(int Case, int Reel)> jobs,
        IReadOnlyDictionary<string, (int Misses, int Accepted)> benchmark,
        int parts,
        int seeds,
        double wall
    )
    {
        var lines = new List<string>
        {
            Inv($"### The predictive rule on {seeds} more reels per case ({parts} parts each, ")
                + Inv($"seeds {SeedBase} + 1 000 × reel + case)"),
            "",
            "| case | insertions | outside 2 × target | 95 % upper | mean s | by prediction | accepted in the "
                + "learning phase | "
                + "misses in the learning phase | with the benchmark's reel: outside / insertions, 95 % upper |",
            "|---|---|---|---|---|---|---|---|---|",
        };
        var (allMiss, allN, allSeconds, allPooledMiss, allPooledN) = (0, 0, 0.0, 0, 0);
        for (var ci = 0; ci < cases.Count; ci++)
        {
            var runs = jobs.Select((job, j) => (job, j)).Where(x => x.job.Case == ci).Select(x => reels[x.j]).ToList();
            var n = runs.Sum(r => r.Accepted);
            var miss = runs.Sum(r => r.Misses.Count);
            var seconds = runs.Sum(r => r.Seconds);
            var learningMiss = runs.Sum(r => r.Misses.Count(m => m.Learning));
            var pooled = benchmark.TryGetValue(cases[ci].Name, out var b)
                ? Inv($"{miss + b.Misses} / {n + b.Accepted}, ")
                    + Inv($"{100 * ClopperPearson.Upper(miss + b.Misses, n + b.Accepted):0.000} %")
                : "— (no benchmark figures)";
            (allMiss, allN, allSeconds) = (allMiss + miss, allN + n, allSeconds + seconds);
            (allPooledMiss, allPooledN) = (allPooledMiss + miss + b.Misses, allPooledN + n + b.Accepted);
            lines.Add(
                Inv($"| {cases[ci].Name} | {n} | {miss} | {100 * ClopperPearson.Upper(miss, n):0.000} % | ")
                    + Inv($"{seconds / n:0.00} | {100.0 * runs.Sum(r => r.Predicted) / n:0.0} % | ")
                    + Inv($"{100.0 * runs.Sum(r => r.Learning) / n:0.0} % | {learningMiss} | {pooled} |")
            );
        }

        lines.Add(
            Inv($"| **all eight cases** | {allN} | {allMiss} | {100 * ClopperPearson.Upper(allMiss, allN):0.000} % | ")
                + Inv($"{allSeconds / allN:0.00} | | | | {allPooledMiss} / {allPooledN}, ")
                + Inv($"{100 * ClopperPearson.Upper(allPooledMiss, allPooledN):0.000} % |")
        );
        lines.Add("");
        lines.Add(
            "*Learning phase*: accepted before the reel prior's body range was learned (the wide prior). *Misses* "
                + "(values "
                + "outside 2 × target), each: case, seed, part index, error, seconds, phase, rule that accepted, fit."
        );
        lines.Add("");
        var any = false;
        for (var ci = 0; ci < cases.Count; ci++)
        {
            foreach (var (job, j) in jobs.Select((job, j) => (job, j)).Where(x => x.job.Case == ci))
            {
                foreach (var m in reels[j].Misses)
                {
                    any = true;
                    var fit = m.Fit is { } f
                        ? Inv($"prediction, {f.Model}, body {f.BodyTimeConstant:0.00} s, ")
                            + Inv($"u {m.UPpm:0.0} ppm, floor ")
                            + (f.BodyFloor is { } fl ? Inv($"{fl:0.00} s") : "none")
                        : "averaging fallback";
                    lines.Add(
                        Inv($"- {cases[ci].Name}, seed {m.Seed}: part {m.Part}, ")
                            + Inv($"{m.ErrorPpm:0.0} ppm at {m.Seconds:0.00} s, ")
                            + (m.Learning ? "learning phase" : "learned range")
                            + Inv($", {fit}")
                    );
                }
            }
        }

        if (!any)
        {
            lines.Add("- none");
        }

        lines.Add("");
        lines.Add(
            Inv($"Run: `settle-seeds {parts} {seeds}`, two reels at a time, {wall:0} s wall on ")
                + Inv($"{Environment.ProcessorCount} cores, .NET {Environment.Version}.")
        );
        return lines;
    }

    /// <summary>The predictive rule's count outside 2 × target and accepted parts per case, read from the benchmark's
    /// overview table in docs/bench-settle.md ("n / accepted, upper" in the row of the case).</summary>
    internal static Dictionary<string, (int Misses, int Accepted)> BenchmarkCounts(string text)
    {
        var counts = new Dictionary<string, (int, int)>();
        var begin = text.IndexOf(ResultsTable.Begin, StringComparison.Ordinal);
        var start = begin < 0 ? -1 : text.IndexOf("\n| case |", begin, StringComparison.Ordinal);
        var stop = start < 0 ? -1 : text.IndexOf("\n### ", start, StringComparison.Ordinal);
        if (start < 0 || stop < start)
        {
            return counts;
        }

        foreach (var row in text[start..stop].Split('\n').Where(l => l.StartsWith("| ", StringComparison.Ordinal)))
        {
            var cells = row.Split('|').Select(x => x.Trim()).ToArray();
            if (cells.Length < 8)
            {
                continue;
            }

            var fraction = cells[7].Split(',')[0].Split('/');
            if (
                fraction.Length == 2
                && int.TryParse(fraction[0], CultureInfo.InvariantCulture, out var miss)
                && int.TryParse(fraction[1], CultureInfo.InvariantCulture, out var accepted)
            )
            {
                counts[cells[1]] = (miss, accepted);
            }
        }

        return counts;
    }

    private static string Inv(FormattableString text) => FormattableString.Invariant(text);

    private sealed class ReelRun(int seed)
    {
        public int Seed { get; } = seed;
        public int Accepted { get; set; }
        public int Unstable { get; set; }
        public int Predicted { get; set; }
        public int Learning { get; set; }
        public double Seconds { get; set; }
        public int LearnedFrom { get; set; }
        public List<Miss> Misses { get; } = [];
    }

    private sealed record Miss(
        int Seed,
        int Part,
        double ErrorPpm,
        double Seconds,
        bool Learning,
        RecoveryFit? Fit,
        double UPpm
    );
}
