using System.Globalization;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>`planning` benchmark: cup-planner yield, assembler time, sweep-vs-exact gap; writes
/// docs/bench-planning.md.</summary>
internal static class PlanningBenchmark
{
    public static async Task<int> RunAsync(string section, CancellationToken ct)
    {
        var root = FindRoot();
        if (section.EndsWith("+fixed", StringComparison.Ordinal))
        {
            (YieldBench.FollowParts, section) = (false, section[..^"+fixed".Length]);
        }

        async Task<Recipe> Load(string f) =>
            await RecipeLoader.LoadFileAsync(Path.Combine(root, "recipes", f), ct).ConfigureAwait(false);
        var quad = await Load("matched-quad.yaml").ConfigureAwait(false);
        var r2r = await Load("r2r-dac-8bit.yaml").ConfigureAwait(false);
        var diffAmp = await Load("diff-amp-g10.yaml").ConfigureAwait(false);
        var divider = await Load("decade-divider.yaml").ConfigureAwait(false);
        var triple = RecipeLoader.Load(
            "recipe: triple-pairs\nform: matched\nmatch-ppm: 1000\npositions:\n  - { name: A, nominal: 10k, pairs: "
                + "[parallel] }\n  - { name: B, nominal: 10k }\n  - { name: C, nominal: 20k, pairs: [series] }\n",
            "bench"
        );

        var all = section == "all";
        var yield = all || section is "cups" or "cups-write" ? YieldBench.Run(quad) : [];
        Console.WriteLine(string.Join('\n', yield));
        var losses = all || section is "cups" or "cups-loss" or "cups-write" ? CupLossBench.Run(quad) : [];
        Console.WriteLine(string.Join('\n', losses));
        if (section == "cups-write")
        {
            await RewriteSectionAsync(root, CupsSection(yield, losses), ct).ConfigureAwait(false);
            return 0;
        }

        if (section == "cups-loss")
        {
            return 0;
        }

        if (section.StartsWith("show:", StringComparison.Ordinal))
        {
            var w = section.Split(':');
            YieldBench.Show(
                quad,
                w[1],
                int.Parse(w[2], CultureInfo.InvariantCulture),
                int.Parse(w[3], CultureInfo.InvariantCulture)
            );
            return 0;
        }

        if (section == "cups-seeds" || section.StartsWith("cups-seeds:", StringComparison.Ordinal))
        {
            // cups-seeds[:first seed:count], default 101:20
            var w = section.Split(':');
            var seeds =
                w.Length == 3
                    ? YieldBench.RunOtherSeeds(
                        quad,
                        int.Parse(w[1], CultureInfo.InvariantCulture),
                        int.Parse(w[2], CultureInfo.InvariantCulture)
                    )
                    : YieldBench.RunOtherSeeds(quad);
            Console.WriteLine(string.Join('\n', seeds));
            return 0;
        }

        var gap =
            all || section == "gap"
                ? GapBench.Run([
                    ("matched-quad, unequal uncertainty, 16 parts", quad, [10e3], 16, 700, 150),
                    ("10k∥pair / 10k / 20k-series, 14 parts", triple, [10e3, 20e3], 14, 700, 100),
                    ("diff-amp-g10, 16 parts", diffAmp, [1e3, 10e3], 16, 400, 20),
                    ("decade-divider, 12 parts", divider, [90e3, 9e3, 1e3, 2e3], 12, 300, 20),
                ])
                : [];
        Console.WriteLine(string.Join('\n', gap));
        var every = new List<(string, Recipe)>();
        foreach (var f in Directory.GetFiles(Path.Combine(root, "recipes"), "*.yaml").Order(StringComparer.Ordinal))
        {
            every.Add(
                (Path.GetFileNameWithoutExtension(f), await RecipeLoader.LoadFileAsync(f, ct).ConfigureAwait(false))
            );
        }

        if (section.StartsWith("colbound", StringComparison.Ordinal))
        {
            // colbound[:parts[:grid steps]]
            var w = section.Split(':');
            var size = w.Length > 1 ? int.Parse(w[1], CultureInfo.InvariantCulture) : 1000;
            var steps = w.Length > 2 ? int.Parse(w[2], CultureInfo.InvariantCulture) : 32;
            ColumnBoundProbe.Run(every, steps, size);
            return 0;
        }

        if (section.StartsWith("mlpglop", StringComparison.Ordinal))
        {
            var w = section.Split(':');
            MatchedLpGlop.Run(
                every.First(e => e.Item1 == "ratio-set").Item2,
                w.Length > 1 ? int.Parse(w[1], CultureInfo.InvariantCulture) : 1000,
                w.Length > 2 ? double.Parse(w[2], CultureInfo.InvariantCulture) : 60
            );
            return 0;
        }

        if (section.StartsWith("mlp", StringComparison.Ordinal))
        {
            var w = section.Split(':');
            MatchedLpProbe.Run(
                every.First(e => e.Item1 == "ratio-set").Item2,
                w.Length > 1 ? int.Parse(w[1], CultureInfo.InvariantCulture) : 1000,
                w.Length > 2 ? double.Parse(w[2], CultureInfo.InvariantCulture) : 60
            );
            return 0;
        }

        if (section == "ratio-seeds")
        {
            RatioSeedsProbe.Run(every.First(e => e.Item1 == "ratio-set").Item2);
            return 0;
        }

        if (section == "ladder")
        {
            LadderProbe.Run(every.First(e => e.Item1 == "r2r-dac-8bit").Item2);
            return 0;
        }

        if (section == "probe")
        {
            var some = every.Where(e => e.Item1 is "ratio-set" or "diff-amp-g10" or "decade-divider").ToList();
            foreach (var w in new[] { 10, 14 })
            {
                Console.WriteLine($"window {w}");
                ReelBench.Run(some, 1000, TimeSpan.FromSeconds(10), seed: 1, window: w, bimodal: false);
            }

            return 0;
        }

        // `reference` (or `reference=name,…`): sub-reels solved exactly by CP-SAT against the search; not part of
        // `planning`.
        var refNames = section.StartsWith("reference", StringComparison.Ordinal)
            ? section.Split('=') is [_, var named]
                ? named.Split(',')
                : ["decade-divider", "diff-amp-g10"]
            : [];
        var reference = SliceReference.Run(
            new (string File, double Width)[] { ("decade-divider", 500), ("diff-amp-g10", 250) }
                .Where(c => refNames.Contains(c.File))
                .Select(c => (c.File, every.Single(e => e.Item1 == c.File).Item2, c.Width))
                .ToList(),
            seed: 1,
            TimeSpan.FromSeconds(2)
        );
        if (refNames.Length > 0)
        {
            return 0;
        }

        // `limit=SECONDS:a,b` runs the reel section for the named recipes with another time limit (normal reels).
        if (section.StartsWith("limit=", StringComparison.Ordinal))
        {
            var w = section["limit=".Length..].Split(':');
            var names = w[1].Split(',');
            ReelBench.Run(
                every.Where(e => names.Contains(e.Item1)).ToList(),
                1000,
                TimeSpan.FromSeconds(double.Parse(w[0], CultureInfo.InvariantCulture)),
                seed: 1
            );
            return 0;
        }

        // `reels=a,b` runs the reel section for the named recipes only (a quick check while working on one recipe).
        var only = section.StartsWith("reels=", StringComparison.Ordinal)
            ? section["reels=".Length..].Split(',')
            : null;
        var chosen = only is null ? every : every.Where(e => only.Contains(e.Item1)).ToList();
        var reels =
            all || section == "reels" || only is not null
                ? ReelBench.Run(chosen, 1000, TimeSpan.FromSeconds(10), seed: 1)
                : [];
        var big =
            all || section == "big"
                ? ReelBench.Run([("matched-quad", quad)], 10_000, TimeSpan.FromSeconds(60), seed: 1)
                : [];
        var paired = every
            .Where(e => e.Item2.Form == RecipeForm.Matched && e.Item2.Positions.Any(p => p.Pairs != PairBuilds.None))
            .Take(1)
            .Select(e => (e.Item1 + " (pairs)", e.Item2));
        var timing =
            all || section == "timing"
                ? TimingBench.Run([("matched-quad", quad), .. paired, ("r2r-dac-8bit", r2r)])
                : [];
        Console.WriteLine(string.Join('\n', timing));
        if (!all)
        {
            return 0;
        }

        var md = new List<string>
        {
            "# Planning benchmark",
            "",
            "Reproduce: `dotnet run -c Release --project bench/SortRig.Bench -- planning` (writes this file; "
                + "`planning gap|reels|big|cups|timing` runs one section",
            "without writing). Deterministic: every reel and instance is seeded; the neighbourhood search is seeded "
                + "too.",
            string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"Machine: {Environment.ProcessorCount} cores shared with other builds and test runs while this ran, "
                    + $".NET {Environment.Version};"
            ),
            "times are wall times on that loaded machine. Simulated data is our own (seeded), not a reference.",
            "",
            "## Reel-scale search vs the exact search (small instances)",
            "",
            "The reel-scale path (exact search off: window sweep, then neighbourhood search with windows of 10 "
                + "parts, smaller than",
            "the instances) against the exact search; 'without search' = the same with the neighbourhood search off "
                + "(the sweep, and the",
            "ratio-pair start and the column LP's exact cover where they apply: so on the divider it is exact). Seeds "
                + "0–39; expanded",
            "uncertainty uniform up to the stated ppm. 'bound sum' is the reel-scale path's proven upper bound "
                + "summed over the instances;",
            "'bound < exact' counts instances where it fell below the exact optimum (must be 0). It includes the "
                + "column "
                + "LP (every feasible set enumerated at this size; docs/planning.md).",
            "",
        };
        md.AddRange(gap);
        md.AddRange([
            "",
            "## Reels of 1 000 parts, every recipe in recipes/",
            "",
            "Default options (time limit 10 s). Nominals drawn in proportion to one set's needs (a position allowing "
                + "pairs shares its",
            "weight with its pair nominal); 'normal' σ = 1 %/3 truncated at ±1 %, 'bimodal' σ = 1 %/2 with "
                + "|deviation| < 0.4 % missing;",
            "expanded transfer uncertainty uniform 5–15 ppm (unequal: the sweep's exact case does not apply); seed "
                + "1. 'upper bound' is proven (never below the optimum); gap = (bound − sets) / bound.",
            "'part count' = the smaller of the Hall-type counting bound and the supply LP over nominal classes (a "
                + "part in a pair",
            "gives half a fill; docs/planning.md); for the matched form parts that fit no common window are not "
                + "counted, for networks",
            "of at most 7 positions parts that no set within the reel's range can hold. 'column LP' = the set-packing "
                + "LP over every",
            "feasible set by column generation, shown where it was proven within its share of the time limit and "
                + "beat the part count",
            "(3-position networks such as the divider, and the difference amplifiers with duals equal within bins "
                + "of parts: 0.85",
            "of the limit; the matched form above 400 parts, the ratio set: a master that pools the common parts of "
                + "one nominal, three",
            "tenths; docs/planning.md). 'SweepAndColumnLp': the LP's sets packed again (an exact cover at the LP's "
                + "minimum cost is",
            "optimal), before the neighbourhood search. Time includes the bound; a search that stops",
            "at the time limit shows about 10 s.",
            "",
        ]);
        md.AddRange(reels);
        md.AddRange(["", "## 10 000 parts, matched quad", "", "Time limit 60 s; otherwise as above.", ""]);
        md.AddRange(big);
        md.AddRange(["", .. CupsSection(yield, losses)]);
        md.AddRange([
            "",
            "## Sweep time",
            "",
            "The window sweep alone (neighbourhood search off), median of 3 runs after a warm-up; the bound steps "
                + "run as in the",
            "assembler (the ratio set's 1 000 parts include the column LP, at most three tenths of the 10 s limit). "
                + "Parts of the recipe's nominals",
            "(and pair nominals), deviations normal σ = 0.3 %, 10 ppm uncertainty.",
            "",
        ]);
        md.AddRange(timing);
        var path = Path.Combine(root, "docs", "bench-planning.md");
        md.AddRange(await KeptSectionAsync(path, ct).ConfigureAwait(false));
        await File.WriteAllLinesAsync(path, md, ct).ConfigureAwait(false);
        return 0;
    }

    private static List<string> CupsSection(List<string> yield, List<string> losses) =>
        [CupsHeading, "", .. YieldBench.Description, .. yield, "", .. CupLossBench.Description, .. losses];

    private const string CupsHeading = "## Online cups vs their K-cup bound";

    // `planning cups-write`: replaces only the cups section of docs/bench-planning.md (up to the next heading), so the
    // cup planner's figures can be brought up to date without running the long assembler sections.
    private static async Task RewriteSectionAsync(string root, List<string> section, CancellationToken ct)
    {
        var path = Path.Combine(root, "docs", "bench-planning.md");
        var lines = (await File.ReadAllLinesAsync(path, ct).ConfigureAwait(false)).ToList();
        var start = lines.IndexOf(CupsHeading);
        if (start < 0)
        {
            throw new InvalidOperationException($"{path} has no '{CupsHeading}' section");
        }

        var end = lines.FindIndex(start + 1, l => l.StartsWith("## ", StringComparison.Ordinal));
        end = end < 0 ? lines.Count : end;
        lines.RemoveRange(start, end - start);
        lines.InsertRange(start, [.. section, ""]);
        await File.WriteAllLinesAsync(path, lines, ct).ConfigureAwait(false);
    }

    private const string ReferenceHeading = "## Sub-reels solved exactly";

    // The CP-SAT reference (`planning reference`, over 10 minutes on a loaded machine) is not rerun by `planning`: its
    // section is carried over from the file as it stands, with its own date and load.
    private static async Task<List<string>> KeptSectionAsync(string path, CancellationToken ct)
    {
        if (!File.Exists(path))
        {
            return [];
        }

        var lines = await File.ReadAllLinesAsync(path, ct).ConfigureAwait(false);
        var start = Array.FindIndex(lines, l => l.StartsWith(ReferenceHeading, StringComparison.Ordinal));
        return start < 0 ? [] : ["", .. lines[start..]];
    }

    private static string FindRoot()
    {
        var dir = new DirectoryInfo(Directory.GetCurrentDirectory());
        while (dir is not null && !File.Exists(Path.Combine(dir.FullName, "SortRig.sln")))
        {
            dir = dir.Parent;
        }

        return dir?.FullName ?? throw new InvalidOperationException("run from inside the repository");
    }
}
