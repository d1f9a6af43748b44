using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>Sets found by the sweep vs the exact search, on instances small enough for the exact search.</summary>
internal static class GapBench
{
    private static readonly int s_instances = 40;

    public static List<string> Run(IReadOnlyList<(string Label, Recipe Recipe, double[] Nominals, int Parts, double SigmaPpm, double MaxUPpm)> cases)
    {
        var rows = new List<string> { "| case | instances | exact sets | sweep sets | gap | instances where sweep < exact |", "|---|---|---|---|---|---|" };
        var sweepOnly = new SetAssembler(new AssemblyOptions(exactPartLimit: 0));
        var exact = new SetAssembler(new AssemblyOptions(exactPartLimit: 64, exactSetLimit: 5_000_000));
        foreach (var (label, recipe, nominals, count, sigma, maxU) in cases)
        {
            int e = 0, s = 0, worse = 0, done = 0;
            for (var seed = 0; seed < s_instances; seed++)
            {
                var rng = new Random(seed);
                var parts = Enumerable.Range(1, count).Select(i => Reels.Part(i, nominals[rng.Next(nominals.Length)], sigma * Reels.Gauss(rng), rng.NextDouble() * maxU)).ToList();
                var ex = exact.Assemble(recipe, parts);
                if (ex.Method != AssemblyMethod.Exact)
                {
                    continue;
                }

                var sw = sweepOnly.Assemble(recipe, parts);
                done++;
                e += ex.Sets.Count;
                s += sw.Sets.Count;
                worse += sw.Sets.Count < ex.Sets.Count ? 1 : 0;
            }

            rows.Add(FormattableString.Invariant($"| {label} | {done} | {e} | {s} | {(e == 0 ? 0 : 100.0 * (e - s) / e):0.0} % | {worse} |"));
        }

        return rows;
    }
}
