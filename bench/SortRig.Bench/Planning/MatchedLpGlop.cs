using System.Diagnostics;
using Google.OrTools.LinearSolver;
using SortRig.Planning.Assembly;
using SortRig.Planning.Assembly.ColumnBound;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>`planning mlpglop[:parts]`: the matched column LP with GLOP (OR-Tools) as the master; bench
/// reference.</summary>
internal static class MatchedLpGlop
{
    public static void Run(Recipe recipe, int size, double seconds)
    {
        foreach (var (shape, devs) in new[] { ("normal", Reels.Normal(1, size)), ("bimodal", Reels.Bimodal(1, size)) })
        {
            if (Environment.GetEnvironmentVariable("MLPSHAPE") is { } only && only != shape)
            {
                continue;
            }

            var parts = ReelBench.Draw(recipe, devs, 1);
            var options = new AssemblyOptions();
            var pool = new CandidatePool(recipe, parts, options, withPairs: false);
            var rule = new MatchedRule(recipe);
            var swept = new SweepPlanner(recipe, pool, rule, options).Run();
            var total = Stopwatch.StartNew();
            var pricing = new MatchedPricing(recipe, pool.Usable, options, 32);
            var n = pool.Usable.Count;
            using var solver = Solver.CreateSolver("GLOP");
            var rows = Enumerable.Range(0, n).Select(_ => solver.MakeConstraint(double.NegativeInfinity, 1)).ToArray();
            var obj = solver.Objective();
            obj.SetMaximization();
            var keys = new HashSet<string>();
            var cols = 0;
            void Add(int[] c)
            {
                if (!keys.Add(string.Join(',', c.Order())))
                {
                    return;
                }

                var v = solver.MakeNumVar(0, double.PositiveInfinity, "");
                obj.SetCoefficient(v, 1);
                foreach (var i in c)
                {
                    rows[i].SetCoefficient(v, 1);
                }

                cols++;
            }

            foreach (var s in swept)
            {
                Add(s.Fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A]).ToArray());
            }

            var sw = Stopwatch.StartNew();
            var best = double.PositiveInfinity;
            for (var round = 1; total.Elapsed.TotalSeconds < seconds; round++)
            {
                sw.Restart();
                solver.Solve();
                var tm = sw.Elapsed.TotalMilliseconds;
                var lp = obj.Value();
                var y = rows.Select(r => Math.Max(0, r.DualValue())).ToArray();
                sw.Restart();
                var p = pricing.Price(y, 2000, () => false);
                var tp = sw.Elapsed.TotalMilliseconds;
                var bound = p.Min > 0 ? y.Sum() / p.Min : double.PositiveInfinity;
                best = Math.Min(best, bound);
                var before = cols;
                foreach (var c in p.Columns)
                {
                    Add(c);
                }

                Console.WriteLine(
                    $"  {shape} round {round}: GLOP {tm:0} ms value {lp:0.0000} cols {cols}, pricing {tp:0} "
                        + $"ms, "
                        + $"m {p.Min:0.000000}, bound {bound:0.0000}, best {best:0.0000}"
                );
                if (cols == before)
                {
                    break;
                }
            }

            if (Environment.GetEnvironmentVariable("MLPWHERE") is not null)
            {
                // Where the LP's fractional sets lie against the search's sets, by the mean z of a set's parts.
                solver.Solve();
                var lpBy = new SortedDictionary<int, double>();
                var vars = solver.variables();
                var colParts = keys.Select(k => k.Split(',').Select(int.Parse).ToArray()).ToList();
                int Bucket(IEnumerable<double> zs) => (int)Math.Floor(zs.Average() * 1e6 / 1000);
                double Z(PartCandidate p) => Math.Log(p.Value.Value / p.Nominal);
                for (var j = 0; j < vars.Count; j++)
                {
                    var x = vars[j].SolutionValue();
                    if (x > 1e-9)
                    {
                        var b = Bucket(colParts[j].Select(i => Z(pool.Usable[i])));
                        lpBy[b] = lpBy.GetValueOrDefault(b) + x;
                    }
                }

                var found = new SetAssembler(new AssemblyOptions()).Assemble(recipe, parts);
                var searchBy = new SortedDictionary<int, double>();
                foreach (var set in found.Sets)
                {
                    var b = Bucket(set.Fills.SelectMany(f => f.Parts).Select(Z));
                    searchBy[b] = searchBy.GetValueOrDefault(b) + 1;
                }

                Console.WriteLine(
                    $"{shape}: search {found.Sets.Count} sets, LP {lpBy.Values.Sum():0.000}; by mean z of the set's "
                        + $"parts (1000 ppm buckets):"
                );
                foreach (var b in lpBy.Keys.Union(searchBy.Keys).Order())
                {
                    Console.WriteLine(
                        string.Create(
                            System.Globalization.CultureInfo.InvariantCulture,
                            $"  [{b * 1000}, {(b + 1) * 1000}) ppm: LP {lpBy.GetValueOrDefault(b):0.000}, search "
                                + $"{searchBy.GetValueOrDefault(b)}"
                        )
                    );
                }
            }

            if (Environment.GetEnvironmentVariable("MLPDUMP") is { } dump)
            {
                solver.Solve();
                File.WriteAllLines(
                    dump + "." + shape,
                    pool.Usable.Select(
                        (u, i) =>
                            string.Create(
                                System.Globalization.CultureInfo.InvariantCulture,
                                $"{u.Nominal} {1e6 * ((u.Value.Value / u.Nominal) - 1):0.0} "
                                    + $"{1e6 * u.Value.ExpandedTransfer / u.Nominal:0.0} "
                                    + $"{Math.Max(0, rows[i].DualValue()):0.000000}"
                            )
                    )
                );
            }

            Console.WriteLine(
                $"{shape}: usable {n}, swept {swept.Count}, LP {best:0.0000} in {total.Elapsed.TotalSeconds:0.0} s"
            );
        }
    }
}
