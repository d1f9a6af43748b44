using System.Diagnostics;
using Google.OrTools.Sat;
using SortRig.Planning.Assembly.ColumnBound;

namespace SortRig.Bench.Planning;

/// <summary>
/// Bench-only reference for the packing of the column LP's sets (`planning colbound`): CP-SAT packs the LP's pool as
/// a plain set packing, and the tight columns with an exact cover of the positive-dual parts (the equalities the
/// product's cover search uses), for 2 s and 5 s each. OR-Tools stays out of the product.
/// </summary>
internal static class PoolCpSat
{
    public static void Report(ColumnBoundResult r, IReadOnlyList<int[]> tight, int parts)
    {
        foreach (var (label, cols, cover) in new[] { ("pool", r.Pool, false), ("tight+cover", tight, true) })
        {
            foreach (var seconds in new[] { 2, 5 })
            {
                var model = new CpModel();
                var x = cols.Select((_, j) => model.NewBoolVar($"c{j}")).ToArray();
                var byPart = new List<ILiteral>[parts];
                for (var j = 0; j < cols.Count; j++)
                {
                    foreach (var i in cols[j])
                    {
                        (byPart[i] ??= []).Add(x[j]);
                    }
                }

                for (var i = 0; i < parts; i++)
                {
                    if (byPart[i] is not { } literals)
                    {
                        continue;
                    }

                    if (cover && r.Duals[i] > 1e-9)
                    {
                        model.AddExactlyOne(literals);
                    }
                    else if (literals.Count > 1)
                    {
                        model.AddAtMostOne(literals);
                    }
                }

                model.Maximize(LinearExpr.Sum(x));
                var solver = new CpSolver { StringParameters = $"num_workers:2,max_time_in_seconds:{seconds}" };
                var t = Stopwatch.StartNew();
                var status = solver.Solve(model);
                Console.WriteLine(
                    $"  CP-SAT {label} {cols.Count} columns, {seconds} s: {status} {solver.ObjectiveValue} "
                        + $"(bound {solver.BestObjectiveBound}) in {t.Elapsed.TotalSeconds:0.00} s"
                );
            }
        }
    }
}
