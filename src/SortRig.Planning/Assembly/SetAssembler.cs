using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Logging.Abstractions;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Chooses disjoint sets of parts that each meet every spec of a recipe in the worst case, maximising the number of
/// sets and then minimising the sum of set scores. Exact on small instances; on large ones a window sweep, then a
/// neighbourhood search within the time limit. Every result carries a proven upper bound on the number of sets.
/// Pure computation; thread-safe (no mutable state between calls).
/// </summary>
/// <param name="options">Limits; null for the defaults.</param>
/// <param name="logger">Logger; null for none.</param>
/// <param name="timeProvider">Clock for the time limit and the reported time; null for the system clock.</param>
public sealed class SetAssembler(
    AssemblyOptions? options = null,
    ILogger<SetAssembler>? logger = null,
    TimeProvider? timeProvider = null
)
{
    private readonly TimeProvider _time = timeProvider ?? TimeProvider.System;
    private readonly AssemblyOptions _options = options ?? new AssemblyOptions();
    private readonly ILogger _logger = (ILogger?)logger ?? NullLogger.Instance;

    /// <summary>Assembles sets.</summary>
    /// <param name="recipe">A loaded recipe.</param>
    /// <param name="parts">Measured parts with unique ids; parts of nominals the recipe cannot use are reported
    /// unused.</param>
    /// <param name="cancellationToken">Stops the search (throws); <see cref="AssemblyOptions.TimeLimit"/> instead
    /// returns the best so far.</param>
    /// <returns>The sets with a proven upper bound on their number, the gap, the method and the time.</returns>
    /// <exception cref="ArgumentException">Duplicate part ids, or a part whose value is not finite and &gt;
    /// 0.</exception>
    public AssemblyResult Assemble(
        Recipe recipe,
        IReadOnlyList<PartCandidate> parts,
        CancellationToken cancellationToken = default
    )
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
                throw new ArgumentException(
                    $"part {p.Id} needs a finite value > 0 and an uncertainty >= 0",
                    nameof(parts)
                );
            }
        }

        var started = _time.GetTimestamp();
        ISetRule rule = recipe.Form == RecipeForm.Matched ? new MatchedRule(recipe) : new NetworkRule(recipe);
        var exact =
            parts.Count(p => recipe.Positions.Any(pos => CandidatePool.Wanted(pos, p.Nominal, _options)))
            <= _options.ExactPartLimit;
        var pool = new CandidatePool(recipe, parts, _options, withPairs: exact);
        AssemblyResult result;
        if (exact && new ExactPacker(recipe, pool, rule, _options).Solve() is { } sets)
        {
            result = Result(
                recipe,
                pool,
                sets,
                AssemblyMethod.Exact,
                $"exact search over {pool.Usable.Count} usable parts",
                sets.Count,
                "exact search (every feasible set enumerated and packed)",
                ExactTieBreak,
                _time.GetElapsedTime(started)
            );
        }
        else
        {
            if (exact)
            {
                Log.ExactFallback(_logger, recipe.Name, pool.Usable.Count);
                pool = new CandidatePool(recipe, parts, _options, withPairs: false);
            }

            result = Search(recipe, pool, rule, started, cancellationToken);
        }

        Log.Assembled(
            _logger,
            result.Sets.Count,
            recipe.Name,
            parts.Count,
            result.Method.ToString(),
            result.ProvenOptimal
        );
        return result;
    }

    private AssemblyResult Search(
        Recipe recipe,
        CandidatePool pool,
        ISetRule rule,
        long started,
        CancellationToken cancellationToken
    )
    {
        var sweep = new SweepPlanner(recipe, pool, rule, _options);
        var found = sweep.Run();
        var note =
            (
                sweep.ProvenOptimal
                    ? "window sweep, exact case (matched form, no pairs, equal-width intervals)"
                    : "window sweep"
            ) + (sweep.Dropped > 0 ? $"; {sweep.Dropped} swept sets failed verification" : "");
        if (sweep.ProvenOptimal)
        {
            return Result(
                recipe,
                pool,
                found,
                AssemblyMethod.Sweep,
                note,
                found.Count,
                "window sweep exact case (see docs/planning.md)",
                "none: the sweep's sets are kept as found",
                _time.GetElapsedTime(started)
            );
        }

        // The network filter of the bound may take a tenth of the time limit; parts left then are counted unfiltered.
        var filterBudget = _options.TimeLimit / 10;
        var (bound, boundName) = PartCountBound.ComputeNamed(recipe, pool.Usable, rule, _options, () =>
            _time.GetElapsedTime(started) > filterBudget
        );
        var (paired, pairBound) = RatioPairStart.Run(recipe, pool.Usable, rule, _options, bound, () =>
            _time.GetElapsedTime(started) > _options.TimeLimit * RatioPairShare
        );
        var byPairs = paired.Count > found.Count;
        if (byPairs)
        {
            note += $"; ratio pairs matched over the whole reel: {paired.Count} sets (the sweep had {found.Count})";
            found = paired;
        }

        if (pairBound < bound)
        {
            (bound, boundName) = (
                pairBound.Value,
                $"ratio pairs: half the most disjoint pairs whose ratio some partner allows; part count gave {bound}"
            );
        }

        // The column LP may take up to three tenths of the time limit, 0.85 for a network at reel scale
        // (anytime; skipped when it cannot help).
        var share = ColumnBound.ColumnBoundStep.TimeShare(recipe, pool.Usable.Count);
        ColumnBound.ColumnBoundResult? lp;
        (bound, boundName, lp) = ColumnBound.ColumnBoundStep.Tighten(
            recipe,
            pool.Usable,
            _options,
            found,
            (bound, boundName),
            () => _time.GetElapsedTime(started) > _options.TimeLimit * share
        );
        var packed = false;
        if (lp is { Pool.Count: > 0 } && found.Count < bound)
        {
            // An exact cover of the LP's columns, for at most PoolShare of the time left.
            var before = found.Count;
            var packUntil = _time.GetElapsedTime(started);
            packUntil += (_options.TimeLimit - packUntil) * PoolShare;
            (found, var how) = Packing.PoolPacker.Improve(recipe, pool.Usable, rule, _options, lp, found, () =>
                _time.GetElapsedTime(started) > packUntil
            );
            note += $"; the column LP's {lp.Pool.Count} sets packed again ({how}): {found.Count} sets (had {before})";
            packed = found.Count > before;
        }

        _options.Progress?.Report(new AssemblyProgress("sweep", found.Count, bound, _time.GetElapsedTime(started)));
        var method =
            packed ? AssemblyMethod.SweepAndColumnLp
            : byPairs ? AssemblyMethod.RatioPairs
            : AssemblyMethod.Sweep;
        var tieBreak =
            packed ? "none: the packed sets are kept as found"
            : byPairs ? "none: the matched pairs' sets are kept as found"
            : "none: the sweep's sets are kept as found";
        var search = new NeighbourhoodSearch(recipe, pool.Usable, rule, _options);
        if (found.Count < bound && search.Applies && _options.TimeLimit > TimeSpan.Zero)
        {
            var deadline = _options.TimeLimit;
            var beforeSearch = found.Count;
            found = search.Improve(
                found,
                bound,
                () => _time.GetElapsedTime(started) > deadline,
                (pass, count) =>
                    _options.Progress?.Report(
                        new AssemblyProgress($"neighbourhood pass {pass}", count, bound, _time.GetElapsedTime(started))
                    ),
                cancellationToken
            );
            // After a packing of the LP's sets or the ratio pairs the method names the search only when it added sets.
            method = (packed || byPairs) && found.Count == beforeSearch ? method : AssemblyMethod.SweepAndNeighbourhood;
            tieBreak = "smallest sum of set scores within each re-packed neighbourhood (not over the whole plan)";
            var stopped =
                _time.GetElapsedTime(started) > deadline
                    ? $", stopped by the time limit ({deadline.TotalSeconds:0.#} s)"
                    : "";
            note += string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"; neighbourhood search: {search.Passes} pass(es), {search.Replaced} window(s) re-packed, "
                    + $"{search.Skipped} skipped (their parts could not make another set), "
                    + $"{search.Shrunk} re-packed on fewer parts (too many assignments), "
                    + $"{_options.NeighbourhoodParts} parts per window{stopped}"
            );
            note += search.Released > 0 ? $" ({search.Released} pair(s) given back for leftover singles)" : "";
            note += search.Completed > 0 ? $" ({search.Completed} set(s) completed along chains)" : "";
        }
        else if (
            found.Count < bound
            && !search.Applies
            && _options.NeighbourhoodParts > 0
            && _options.TimeLimit > TimeSpan.Zero
        )
        {
            var deadline = _options.TimeLimit;
            // Sets too large for a window: the sweep on each side of the widest empty stretch of z, kept when better.
            if (GapSplitSweep.Run(recipe, pool, rule, _options) is { } split && split.Sets.Count > found.Count)
            {
                note += string.Create(
                    System.Globalization.CultureInfo.InvariantCulture,
                    $"; split at the widest gap in z ({split.Low * 1e6:0} to {split.High * 1e6:0} ppm): "
                        + $"{split.Sets.Count} sets (had {found.Count})"
                );
                found = split.Sets;
            }

            var repair = new RepairSearch(pool.Usable, rule, new SweepGeometry(recipe, rule), _options);
            var before = found.Count;
            found = repair.Improve(found, bound, () => _time.GetElapsedTime(started) > deadline, cancellationToken);
            _options.Progress?.Report(
                new AssemblyProgress("repair", found.Count, bound, _time.GetElapsedTime(started))
            );
            method = AssemblyMethod.SweepAndRepair;
            tieBreak = "none: swept and repaired sets are kept as found";
            var stopped =
                _time.GetElapsedTime(started) > deadline
                    ? $", stopped by the time limit ({deadline.TotalSeconds:0.#} s)"
                    : "";
            note += string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"; no neighbourhood search ({_options.NeighbourhoodParts} parts cannot hold two sets of "
                    + $"{recipe.Positions.Count} positions); swap/repair added {found.Count - before} set(s){stopped}"
            );
        }
        else if (found.Count < bound && !search.Applies)
        {
            note += string.Create(
                System.Globalization.CultureInfo.InvariantCulture,
                $"; no neighbourhood search: {_options.NeighbourhoodParts} parts cannot hold two sets of "
                    + $"{recipe.Positions.Count} positions"
            );
        }

        return Result(recipe, pool, found, method, note, bound, boundName, tieBreak, _time.GetElapsedTime(started));
    }

    /// <summary>Share of the time limit by which the ratio-pair start stops trying pair windows (each about 1.5–2 s on
    /// a 1 000-part amplifier reel; it stops sooner when the bound is met).</summary>
    private const double RatioPairShare = 0.4;

    /// <summary>Share of the time left after the column LP that the exact cover over its sets may take (the
    /// neighbourhood search has the rest; the cover, when there is one, took 0.05–0.5 s on the divider reels).
    /// </summary>
    private const double PoolShare = 0.6;

    private const string ExactTieBreak =
        "smallest sum of set scores (worst-case error / tolerance per set) among plans with the most sets";

    private static AssemblyResult Result(
        Recipe recipe,
        CandidatePool pool,
        List<(Option[] Fills, SetVerdict Verdict)> sets,
        AssemblyMethod method,
        string note,
        int bound,
        string boundMethod,
        string tieBreak,
        TimeSpan elapsed
    )
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
        return new AssemblyResult(
            recipe.Name,
            assembled,
            unused,
            method,
            assembled.Count >= bound,
            note,
            bound,
            boundMethod,
            tieBreak,
            elapsed
        );
    }
}
