using SortRig.Planning.Assembly;
using SortRig.Planning.Recipes;

namespace SortRig.Bench.Planning;

/// <summary>
/// The reel-scale search (sweep + neighbourhood search, exact search off) vs the exact search, on instances small
/// enough for the exact search. Windows of 10 parts, smaller than the instances, so the neighbourhood search cannot
/// simply solve the whole instance; the assembler without the neighbourhood search is shown for comparison. Also checks
/// the bound is never below the exact optimum.
/// </summary>
internal static class GapBench
{
    private static readonly int s_instances = 40;

    public static List<string> Run(
        IReadOnlyList<(
            string Label,
            Recipe Recipe,
            double[] Nominals,
            int Parts,
            double SigmaPpm,
            double MaxUPpm
        )> cases
    )
    {
        var rows = new List<string>
        {
            "| case | instances | exact sets | without search | gap | search (10-part windows) | gap | instances "
                + "search "
                + "< exact | bound sum | bound < exact |",
            "|---|---|---|---|---|---|---|---|---|---|",
        };
        var sweepOnly = new SetAssembler(new AssemblyOptions(exactPartLimit: 0, neighbourhoodParts: 0));
        var search = new SetAssembler(new AssemblyOptions(exactPartLimit: 0, neighbourhoodParts: 10));
        var exact = new SetAssembler(new AssemblyOptions(exactPartLimit: 64, exactSetLimit: 5_000_000));
        foreach (var (label, recipe, nominals, count, sigma, maxU) in cases)
        {
            int e = 0,
                s = 0,
                n = 0,
                worse = 0,
                done = 0,
                bound = 0,
                below = 0;
            for (var seed = 0; seed < s_instances; seed++)
            {
                var rng = new Random(seed);
                var parts = Enumerable
                    .Range(1, count)
                    .Select(i =>
                        Reels.Part(
                            i,
                            nominals[rng.Next(nominals.Length)],
                            sigma * Reels.Gauss(rng),
                            rng.NextDouble() * maxU
                        )
                    )
                    .ToList();
                var ex = exact.Assemble(recipe, parts);
                if (ex.Method != AssemblyMethod.Exact)
                {
                    continue;
                }

                var sw = sweepOnly.Assemble(recipe, parts);
                var ns = search.Assemble(recipe, parts);
                done++;
                e += ex.Sets.Count;
                s += sw.Sets.Count;
                n += ns.Sets.Count;
                bound += ns.UpperBound;
                worse += ns.Sets.Count < ex.Sets.Count ? 1 : 0;
                below += ns.UpperBound < ex.Sets.Count ? 1 : 0;
            }

            rows.Add(
                string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"| {label} | {done} | {e} | {s} | {Gap(e, s):0.0} % | {n} | {Gap(e, n):0.0} % | {worse} | "
                        + $"{bound} | {below} |"
                )
            );
        }

        return rows;
    }

    private static double Gap(int exact, int found) => exact == 0 ? 0 : 100.0 * (exact - found) / exact;
}
