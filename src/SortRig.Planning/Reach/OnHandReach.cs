using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Assembly;
using SortRig.Planning.Ordering;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Reach;

/// <summary>
/// What the parts on hand can reach: the tightest tolerance scale at which N sets are still made (geometric bisection
/// with the assembler: the invariant is "N sets at the upper end, fewer at the lower end", so the answer is always
/// backed by an assembler run), and which single extra part would make one more set from the leftovers. Pure
/// computation.
/// </summary>
/// <param name="assembly">Assembler limits for every run; null for <see cref="OrderOptions.FastAssembly"/>
/// (repeatable).</param>
public sealed class OnHandReach(AssemblyOptions? assembly = null)
{
    private readonly SetAssembler _assembler = new(assembly ?? OrderOptions.FastAssembly);

    /// <summary>Largest tolerance scale tried when the recipe as written makes fewer than N sets.</summary>
    public const double MaxScale = 1000;

    /// <summary>Finds the reach.</summary>
    /// <param name="recipe">A loaded recipe.</param>
    /// <param name="parts">Parts on hand, unique ids.</param>
    /// <param name="setsWanted">Sets to build, 1 to 10 000.</param>
    /// <param name="precision">Relative width of the final bracket, 0.001 to 0.5; default 0.01.</param>
    /// <param name="scanPoints">Values tried per nominal for the extra part, 10 to 2 000; default 201.</param>
    /// <param name="cancellationToken">Stops the search (throws).</param>
    /// <exception cref="OrderRefusedException">Zero sets wanted, too few parts of a nominal, or no N sets even at
    /// <see cref="MaxScale"/> times the tolerance.</exception>
    public ReachResult Find(
        Recipe recipe,
        IReadOnlyList<PartCandidate> parts,
        int setsWanted,
        double precision = 0.01,
        int scanPoints = 201,
        CancellationToken cancellationToken = default
    )
    {
        ArgumentNullException.ThrowIfNull(recipe);
        ArgumentNullException.ThrowIfNull(parts);
        if (setsWanted is < 1 or > 10_000)
        {
            throw new OrderRefusedException(
                FormattableString.Invariant($"sets: {setsWanted} is not a number of sets to build (1 to 10 000)")
            );
        }

        if (precision is < 0.001 or > 0.5 || scanPoints is < 10 or > 2000)
        {
            throw new ArgumentOutOfRangeException(
                nameof(precision),
                "precision must be 0.001 to 0.5 and scan points 10 to 2 000"
            );
        }

        CheckSupply(recipe, parts, setsWanted);
        var runs = 0;
        int SetsAt(double s)
        {
            runs++;
            return _assembler.Assemble(ToleranceScale.Apply(recipe, s), parts, cancellationToken).Sets.Count;
        }

        var asWritten = SetsAt(1);
        double hi = 1,
            lo = 1;
        int setsHi = asWritten,
            setsLo = asWritten;
        if (setsHi >= setsWanted)
        {
            while (setsLo >= setsWanted)
            {
                (hi, setsHi) = (lo, setsLo);
                lo /= 2;
                if (lo < 1e-9)
                {
                    throw new OrderRefusedException(
                        "the parts make the sets at any tolerance down to 1e-9 of the recipe's: are their "
                            + "uncertainties zero and their values equal?"
                    );
                }

                setsLo = SetsAt(lo);
            }
        }
        else
        {
            while (setsHi < setsWanted)
            {
                (lo, setsLo) = (hi, setsHi);
                hi *= 2;
                if (hi > MaxScale)
                {
                    throw new OrderRefusedException(
                        string.Create(
                            System.Globalization.CultureInfo.InvariantCulture,
                            $"the {parts.Count} parts cannot make {setsWanted} sets of '{recipe.Name}' even at "
                                + $"{MaxScale:0} times its tolerance (best {setsLo}): buy parts first (see the order "
                                + $"estimate)"
                        )
                    );
                }

                setsHi = SetsAt(hi);
            }
        }

        while (hi / lo - 1 > precision)
        {
            var mid = Math.Sqrt(hi * lo);
            var s = SetsAt(mid);
            if (s >= setsWanted)
            {
                (hi, setsHi) = (mid, s);
            }
            else
            {
                (lo, setsLo) = (mid, s);
            }
        }

        var extra = ExtraParts(recipe, parts, scanPoints, cancellationToken);
        return new ReachResult(
            recipe.Name,
            setsWanted,
            parts.Count,
            hi,
            setsHi,
            lo,
            setsLo,
            recipe.Form == RecipeForm.Matched ? recipe.MatchTolerancePpm * hi : null,
            runs,
            asWritten,
            extra
        );
    }

    /// <summary>Refuses when a nominal has fewer parts than N sets take even with every pair build allowed.</summary>
    private static void CheckSupply(Recipe recipe, IReadOnlyList<PartCandidate> parts, int setsWanted)
    {
        var options = OrderOptions.FastAssembly;
        foreach (var group in recipe.Positions.GroupBy(p => p.Nominal))
        {
            // Parts that could fill this nominal's positions: singles count one, pair halves count half.
            var fills = parts.Sum(part =>
                options.SameNominal(part.Nominal, group.Key) ? 1.0
                : group.Any(p => p.Pairs.HasFlag(PairBuilds.Series)) && options.SameNominal(part.Nominal, group.Key / 2)
                    ? 0.5
                : group.Any(p => p.Pairs.HasFlag(PairBuilds.Parallel))
                && options.SameNominal(part.Nominal, group.Key * 2)
                    ? 0.5
                : 0
            );
            var need = group.Count() * setsWanted;
            if (fills < need)
            {
                throw new OrderRefusedException(
                    string.Create(
                        System.Globalization.CultureInfo.InvariantCulture,
                        $"sets: {setsWanted} sets of '{recipe.Name}' need {need} parts of {group.Key:0.###} ohm and "
                            + $"the parts on hand fill at most {Math.Floor(fills):0}"
                    )
                );
            }
        }
    }

    /// <summary>
    /// Per nominal the recipe takes as a single part: scans one extra part over the range of the leftovers' deviations
    /// (widened by a quarter) and keeps the widest contiguous band of values with which the leftovers make a set.
    /// </summary>
    private List<ExtraPart> ExtraParts(
        Recipe recipe,
        IReadOnlyList<PartCandidate> parts,
        int points,
        CancellationToken cancellationToken
    )
    {
        var result = _assembler.Assemble(recipe, parts, cancellationToken);
        var leftovers = result.Unused.ToList();
        var deviations = leftovers
            .Where(p => recipe.Positions.Any(pos => OrderOptions.FastAssembly.SameNominal(p.Nominal, pos.Nominal)))
            .Select(p => (p.Value.Value / p.Nominal) - 1)
            .ToList();
        if (deviations.Count == 0)
        {
            return [];
        }

        var spread = Math.Max(
            deviations.Max() - deviations.Min(),
            recipe.Form == RecipeForm.Matched ? recipe.MatchTolerancePpm * 1e-6 : 1e-3
        );
        var from = deviations.Min() - (spread / 4);
        var to = deviations.Max() + (spread / 4);
        var nextId = parts.Count == 0 ? 1 : parts.Max(p => p.Id) + 1;
        var found = new List<ExtraPart>();
        foreach (var nominal in recipe.Positions.Select(p => p.Nominal).Distinct().Order())
        {
            var same = parts
                .Where(p => OrderOptions.FastAssembly.SameNominal(p.Nominal, nominal))
                .Select(p => p.Value.ExpandedTransfer / p.Value.Value)
                .Order()
                .ToList();
            var uRel = same.Count > 0 ? same[same.Count / 2] : 0;
            (int Start, int End)? best = null;
            int? start = null;
            for (var i = 0; i <= points; i++)
            {
                var works =
                    i < points
                    && MakesASet(
                        recipe,
                        leftovers,
                        nominal,
                        nominal * (1 + from + ((to - from) * i / (points - 1))),
                        uRel,
                        nextId,
                        cancellationToken
                    );
                if (works && start is null)
                {
                    start = i;
                }
                else if (!works && start is { } s)
                {
                    if (best is null || i - 1 - s > best.Value.End - best.Value.Start)
                    {
                        best = (s, i - 1);
                    }

                    start = null;
                }
            }

            if (best is { } b)
            {
                var low = nominal * (1 + from + ((to - from) * b.Start / (points - 1)));
                var high = nominal * (1 + from + ((to - from) * b.End / (points - 1)));
                found.Add(new ExtraPart(nominal, low, high, uRel * nominal));
            }
        }

        return found;
    }

    private bool MakesASet(
        Recipe recipe,
        List<PartCandidate> leftovers,
        double nominal,
        double value,
        double uRel,
        long id,
        CancellationToken cancellationToken
    )
    {
        var u = value * uRel / 2;
        var offered = new List<PartCandidate>(leftovers) { new(id, nominal, new MeasuredValue(value, u, u), "extra") };
        return _assembler.Assemble(recipe, offered, cancellationToken).Sets.Count > 0;
    }
}
