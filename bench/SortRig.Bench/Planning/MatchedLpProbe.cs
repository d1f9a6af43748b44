using System.Diagnostics;
using SortRig.Planning.Assembly;
using SortRig.Planning.Assembly.ColumnBound;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>
/// `planning mlp[:parts[:seconds]]`: the matched column LP with the pooled master on the ratio-set reels (seed 1), one
/// line per pricing round (time since the start, Σ y / m); MLPSHAPE=normal|bimodal for one reel. Not written.
/// </summary>
internal static class MatchedLpProbe
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
            var pricing = new Timed(new MatchedPricing(recipe, pool.Usable, options, ColumnBoundStep.GridSteps), total);
            Console.WriteLine(
                $"{shape}: {pool.Usable.Count} usable, swept {swept.Count}, pricing built "
                    + $"{total.ElapsedMilliseconds} ms"
            );
            var (z, classOf) = ColumnBoundStep.Pooling(pool.Usable, options);
            var r = AggregatedColumnBound.Solve(
                pricing,
                z,
                classOf,
                rule.Window,
                swept.Select(s => s.Fills.SelectMany(f => f.B >= 0 ? new[] { f.A, f.B } : [f.A]).ToArray()),
                () => total.Elapsed.TotalSeconds > seconds
            );
            Console.WriteLine(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"  → {r?.Value:0.0000} → {r?.Bound} in {total.Elapsed.TotalSeconds:0.00} s ({r?.Family})"
                )
            );
        }
    }

    private sealed class Timed(IColumnPricing inner, Stopwatch total) : IColumnPricing
    {
        public string Family => inner.Family;

        public PricingResult Price(ReadOnlySpan<double> duals, int maxColumns, Func<bool> stop)
        {
            var start = total.Elapsed.TotalMilliseconds;
            var r = inner.Price(duals, maxColumns, stop);
            var sum = 0.0;
            foreach (var y in duals)
            {
                sum += y;
            }

            Console.WriteLine(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"  {total.Elapsed.TotalSeconds:0.00} s: pricing {total.Elapsed.TotalMilliseconds - start:0} ms, "
                        + $"Σy {sum:0.0000}, m {r.Min:0.000000}, Σy/m {sum / r.Min:0.0000}, {r.Columns.Count} columns"
                )
            );
            return r;
        }
    }
}
