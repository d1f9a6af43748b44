using System.Diagnostics;
using SortRig.Planning.Assembly.ColumnBound;

namespace SortRig.Bench.Planning;

/// <summary>
/// The column LP's rounds with their times (COLTRACE=1 with `planning colbound`): the same loop as
/// ColumnBoundSolver, printing per round the master's value and time, the pricing's minimum and time, and the bound.
/// </summary>
internal static class ColumnTrace
{
    public static void Run(IColumnPricing pricing, int rows, IEnumerable<int[]> initial, Func<bool> stop, int perRound)
    {
        var master = new ColumnMaster(rows);
        foreach (var c in initial)
        {
            master.Add(c);
        }

        var best = double.PositiveInfinity;
        for (var round = 1; !stop(); round++)
        {
            var sw = Stopwatch.StartNew();
            master.Solve(200_000, stop);
            var tm = sw.Elapsed.TotalSeconds;
            var y = new double[rows];
            for (var i = 0; i < rows; i++)
            {
                y[i] = Math.Max(0, master.Duals[i]);
            }

            sw.Restart();
            var priced = pricing.Price(y, perRound, stop);
            var tp = sw.Elapsed.TotalSeconds;
            var sum = y.Sum();
            var value = priced.Min > 0 ? sum / priced.Min : double.PositiveInfinity;
            best = Math.Min(best, value);
            var added = priced.Columns.Count(c => master.Add(c));
            Console.WriteLine(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"  round {round}: master {master.Value:0.000} ({tm:0.00} s, {master.ColumnCount} cols), "
                        + $"pricing min {priced.Min:0.000000} ({tp:0.00} s), {priced.Columns.Count} new, "
                        + $"bound {value:0.000} (best {best:0.000}), zero-dual parts {y.Count(v => v == 0)}"
                )
            );
            if (priced.Columns.Count == 0 || added == 0 || double.IsNaN(priced.Min))
            {
                break;
            }
        }
    }
}
