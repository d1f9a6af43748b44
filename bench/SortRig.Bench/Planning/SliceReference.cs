using System.Globalization;
using Google.OrTools.Sat;
using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>
/// Offline reference for the reel-scale search (bench only, not product): the 1 000-part reel of the reels section is
/// cut into slices of deviation z = ln(value / nominal) of a given width; each slice is a sub-reel. On each, every
/// feasible set is enumerated (every assignment of singles and pairs judged by the real worst-case rule, so error
/// cancellation counts) and Google OR-Tools CP-SAT packs them exactly (one Boolean per set, each part at most once,
/// maximise the count). The reel-scale search (exact path off) runs on the same sub-reel. The sum of the slice optima
/// is also a feasible plan for the whole reel (slices are disjoint), so it is a lower bound on the reel's optimum.
/// </summary>
internal static class SliceReference
{
    private const long LeafLimit = 4_000_000;

    public static List<string> Run(
        IReadOnlyList<(string File, Recipe Recipe, double WidthPpm)> cases,
        int seed,
        TimeSpan searchLimit
    )
    {
        var rows = new List<string>
        {
            "| recipe | reel | slice | slices | parts | feasible sets | exact sets (CP-SAT) | slices proven optimal | "
                + "search sets | slices where search < exact | slices left out (too many sets, or CP-SAT without a "
                + "solution) |",
            "|---|---|---|---|---|---|---|---|---|---|---|",
        };
        foreach (var (file, recipe, width) in cases)
        {
            foreach (
                var (shape, devs) in new (string, List<double>)[]
                {
                    ("normal", Reels.Normal(seed, 1000)),
                    ("bimodal", Reels.Bimodal(seed, 1000)),
                }
            )
            {
                var reel = ReelBench.Draw(recipe, devs, seed);
                var slices = reel.GroupBy(p => (int)Math.Floor(Math.Log(p.Value.Value / p.Nominal) * 1e6 / width))
                    .OrderBy(g => g.Key)
                    .Select(g => g.ToList())
                    .Where(g => g.Count >= recipe.Positions.Count)
                    .ToList();
                int solved = 0,
                    parts = 0,
                    feasible = 0,
                    exact = 0,
                    optimal = 0,
                    search = 0,
                    worse = 0,
                    tooBig = 0;
                foreach (var slice in slices)
                {
                    var sets = Feasible(recipe, slice);
                    if (sets is null)
                    {
                        tooBig++;
                        continue;
                    }

                    var (count, proven) = Pack(sets, slice.Count);
                    if (count < 0)
                    {
                        // CP-SAT found no packing within its time limit (a loaded machine): not counted.
                        tooBig++;
                        continue;
                    }

                    var found = new SetAssembler(
                        new AssemblyOptions(exactPartLimit: 0, timeLimit: searchLimit)
                    ).Assemble(recipe, slice);
                    if (found.Sets.Count > count && proven)
                    {
                        throw new InvalidOperationException($"search beat the proven optimum on a slice of {file}");
                    }

                    (solved, parts, feasible, exact) = (
                        solved + 1,
                        parts + slice.Count,
                        feasible + sets.Count,
                        exact + count
                    );
                    optimal += proven ? 1 : 0;
                    search += found.Sets.Count;
                    worse += found.Sets.Count < count ? 1 : 0;
                    Console.Error.WriteLine(
                        $"  slice of {slice.Count}: {sets.Count} sets, exact {count}, search {found.Sets.Count}"
                    );
                }

                rows.Add(
                    string.Create(
                        CultureInfo.InvariantCulture,
                        $"| {file} | {shape} | {width:0} ppm | {solved} | {parts} | {feasible:N0} | {exact} | "
                            + $"{optimal} | {search} | {worse} | {tooBig} |"
                    )
                );
                Console.WriteLine(rows[^1]);
            }
        }

        return rows;
    }

    // Every feasible set (best score per part subset does not matter for the count: one per part subset), or null
    // when more than LeafLimit assignments would be judged.
    private static List<int[]>? Feasible(Recipe recipe, List<PartCandidate> parts)
    {
        var options = new AssemblyOptions();
        var pool = new CandidatePool(recipe, parts, options, withPairs: true);
        ISetRule rule = recipe.Form == RecipeForm.Matched ? new MatchedRule(recipe) : new NetworkRule(recipe);
        var fills = new Option[recipe.Positions.Count];
        var used = new bool[pool.Usable.Count];
        var seen = new HashSet<string>(StringComparer.Ordinal);
        var result = new List<int[]>();
        long leaves = 0;
        bool Walk(int k)
        {
            if (k == fills.Length)
            {
                if (++leaves > LeafLimit)
                {
                    return false;
                }

                if (rule.Judge(fills).Meets)
                {
                    var members = fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A]).Order().ToArray();
                    if (seen.Add(string.Join(',', members)))
                    {
                        result.Add(members);
                    }
                }

                return true;
            }

            foreach (var o in pool.Options[k])
            {
                if (used[o.A] || (o.B >= 0 && used[o.B]))
                {
                    continue;
                }

                (used[o.A], fills[k]) = (true, o);
                if (o.B >= 0)
                {
                    used[o.B] = true;
                }

                var ok = Walk(k + 1);
                used[o.A] = false;
                if (o.B >= 0)
                {
                    used[o.B] = false;
                }

                if (!ok)
                {
                    return false;
                }
            }

            return true;
        }

        return Walk(0) ? result : null;
    }

    // CP-SAT set packing: the optimum (or its best when stopped) and whether it is proven; -1 without a solution.
    private static (int Count, bool Proven) Pack(List<int[]> sets, int parts)
    {
        if (sets.Count == 0)
        {
            return (0, true);
        }

        var model = new CpModel();
        var y = sets.Select((_, s) => model.NewBoolVar($"s{s}")).ToArray();
        var byPart = Enumerable.Range(0, parts).Select(_ => new List<ILiteral>()).ToArray();
        for (var s = 0; s < sets.Count; s++)
        {
            foreach (var p in sets[s])
            {
                byPart[p].Add(y[s]);
            }
        }

        foreach (var list in byPart.Where(l => l.Count > 1))
        {
            model.AddAtMostOne(list);
        }

        model.Maximize(LinearExpr.Sum(y));
        var solver = new CpSolver { StringParameters = "num_workers:2,max_time_in_seconds:60" };
        var status = solver.Solve(model);
        return status is CpSolverStatus.Optimal or CpSolverStatus.Feasible
            ? ((int)Math.Round(solver.ObjectiveValue), status == CpSolverStatus.Optimal)
            : (-1, false);
    }
}
