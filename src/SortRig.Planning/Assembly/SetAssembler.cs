using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Chooses disjoint sets of parts that each meet every spec of a recipe in the worst case, maximising the number of
/// sets and then minimising the sum of set scores. Exact on small instances, a window sweep on large ones.
/// Pure computation; thread-safe (no mutable state between calls).
/// </summary>
/// <param name="options">Limits; null for the defaults.</param>
/// <param name="logger">Logger; null for none.</param>
public sealed class SetAssembler(AssemblyOptions? options = null, ILogger<SetAssembler>? logger = null)
{
    private readonly AssemblyOptions _options = options ?? new AssemblyOptions();
    private readonly ILogger _logger = (ILogger?)logger ?? NullLogger.Instance;

    /// <summary>Assembles sets.</summary>
    /// <param name="recipe">A loaded recipe.</param>
    /// <param name="parts">Measured parts with unique ids; parts of nominals the recipe cannot use are reported unused.</param>
    /// <exception cref="ArgumentException">Duplicate part ids, or a part whose value is not finite and &gt; 0.</exception>
    public AssemblyResult Assemble(Recipe recipe, IReadOnlyList<PartCandidate> parts)
    {
        var ids = new HashSet<long>();
        foreach (var p in parts)
        {
            if (!ids.Add(p.Id))
            {
                throw new ArgumentException($"part id {p.Id} appears more than once", nameof(parts));
            }

            if (!(p.Value.Value > 0) || !double.IsFinite(p.Value.Value) || !(p.Value.ExpandedTransfer >= 0))
            {
                throw new ArgumentException($"part {p.Id} needs a finite value > 0 and an uncertainty >= 0", nameof(parts));
            }
        }

        ISetRule rule = recipe.Form == RecipeForm.Matched ? new MatchedRule(recipe) : new NetworkRule(recipe);
        var exact = parts.Count(p => recipe.Positions.Any(pos => CandidatePool.Wanted(pos, p.Nominal, _options))) <= _options.ExactPartLimit;
        var pool = new CandidatePool(recipe, parts, _options, withPairs: exact);
        AssemblyResult result;
        if (exact && new ExactPacker(recipe, pool, rule, _options).Solve() is { } sets)
        {
            result = Result(recipe, pool, sets, AssemblyMethod.Exact, true, $"exact search over {pool.Usable.Count} usable parts");
        }
        else
        {
            if (exact)
            {
                Log.ExactFallback(_logger, recipe.Name, pool.Usable.Count);
                pool = new CandidatePool(recipe, parts, _options, withPairs: false);
            }

            var sweep = new SweepPlanner(recipe, pool, rule, _options);
            var found = sweep.Run();
            var note = (sweep.ProvenOptimal ? "window sweep, exact case (matched form, no pairs, equal-width intervals)" : "window sweep, heuristic")
                + (sweep.Dropped > 0 ? $"; {sweep.Dropped} candidate sets failed verification" : "");
            result = Result(recipe, pool, found, AssemblyMethod.Sweep, sweep.ProvenOptimal, note);
        }

        Log.Assembled(_logger, result.Sets.Count, recipe.Name, parts.Count, result.Method.ToString(), result.ProvenOptimal);
        return result;
    }

    private static AssemblyResult Result(Recipe recipe, CandidatePool pool, List<(Option[] Fills, SetVerdict Verdict)> sets, AssemblyMethod method, bool proven, string note)
    {
        var used = new bool[pool.Usable.Count];
        var assembled = new List<AssembledSet>();
        foreach (var (fills, verdict) in sets.OrderBy(s => s.Verdict.Score))
        {
            foreach (var f in fills)
            {
                used[f.A] = true;
                if (f.B >= 0)
                {
                    used[f.B] = true;
                }
            }

            var positionFills = fills.Select((f, k) => f.ToFill(recipe.Positions[k].Name, pool.Usable)).ToList();
            assembled.Add(new AssembledSet(assembled.Count + 1, positionFills, verdict.Checks));
        }

        var unused = pool.Unusable.Concat(pool.Usable.Where((_, i) => !used[i])).ToList();
        return new AssemblyResult(recipe.Name, assembled, unused, method, proven, note);
    }
}
