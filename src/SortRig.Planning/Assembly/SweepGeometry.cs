using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>
/// Maps a recipe onto the sweep's one-dimensional axis z = ln(value / position nominal). Classes are the distinct
/// position nominals. Matched form: the interval is exact, [ln((x+U)/n) − W/2, ln((x−U)/n) + W/2] with
/// W = ln(1 + tolerance). Network form: outputs do not change when all parts move together, so a set whose parts
/// all lie within h − U/x of a common point c meets every output to first order when
/// h = min over outputs of (tolerance − |error at nominal|) / Σ_k |∂Error/∂ln R_k|. Sets are verified afterwards.
/// </summary>
internal sealed class SweepGeometry
{
    private readonly double[] _halfWidth;
    private readonly bool _matched;

    public SweepGeometry(Recipe recipe, ISetRule rule)
    {
        _matched = recipe.Form == RecipeForm.Matched;
        Nominals = recipe.Positions.Select(p => p.Nominal).Distinct().ToArray();
        ClassOf = recipe.Positions.Select(p => Array.IndexOf(Nominals, p.Nominal)).ToArray();
        Demand = Nominals.Select(n => ClassOf.Count(c => Nominals[c] == n)).ToArray();
        Weights = new double[recipe.Positions.Count];
        PairCaps = new int[Nominals.Length, 3];
        for (var k = 0; k < recipe.Positions.Count; k++)
        {
            var pairs = recipe.Positions[k].Pairs;
            if (pairs != PairBuilds.None)
            {
                PairCaps[
                    ClassOf[k],
                    pairs == PairBuilds.Series ? 0
                    : pairs == PairBuilds.Parallel ? 1
                    : 2
                ]++;
            }
        }

        if (_matched)
        {
            _halfWidth = Enumerable
                .Repeat(Math.Log(1 + (recipe.MatchTolerancePpm * 1e-6)) / 2, Nominals.Length)
                .ToArray();
            return;
        }

        var network = ((NetworkRule)rule).Network;
        var outputs = network.Evaluate(recipe.Positions.Select(p => p.Nominal).ToArray());
        _halfWidth = Enumerable.Repeat(0.5, Nominals.Length).ToArray();
        foreach (var o in outputs)
        {
            // One common half-width: Σ_k |∂Error/∂ln R_k| h ≤ tolerance − |error at nominal|. (An equal share per
            // class was tried and found no better on the gap benchmark; see docs/bench-planning.md.)
            var relative = o.ErrorGradient.Select((g, k) => Math.Abs(g * recipe.Positions[k].Nominal)).ToArray();
            var budget = Math.Max(0, o.Tolerance - Math.Abs(o.Error));
            var h = relative.Sum() > 0 ? budget / relative.Sum() : 0.5;
            for (var j = 0; j < Nominals.Length; j++)
            {
                _halfWidth[j] = Math.Min(_halfWidth[j], h);
            }

            for (var k = 0; k < Weights.Length; k++)
            {
                Weights[k] = Math.Max(Weights[k], relative[k] / o.Tolerance);
            }
        }
    }

    public double[] Nominals { get; }

    /// <summary>Class (distinct nominal) of each position.</summary>
    public int[] ClassOf { get; }

    /// <summary>Positions of each class in one set.</summary>
    public int[] Demand { get; }

    /// <summary>Per class: positions allowing series only, parallel only, both.</summary>
    public int[,] PairCaps { get; }

    /// <summary>Network form: how much each position matters (max over outputs of |∂Error/∂ln R| /
    /// tolerance).</summary>
    public double[] Weights { get; }

    /// <summary>Deviation of an option on the common axis, ln(value / nominal).</summary>
    public double Z(int cls, Option o) => Math.Log(o.Value / Nominals[cls]);

    /// <summary>The option's interval of admissible common points, or null when its own uncertainty is too
    /// large.</summary>
    public SweepItem? Item(int cls, Option o, int kind)
    {
        double left,
            right;
        if (_matched)
        {
            if (o.Value <= o.Uncertainty)
            {
                return null;
            }

            left = Math.Log((o.Value + o.Uncertainty) / Nominals[cls]) - _halfWidth[cls];
            right = Math.Log((o.Value - o.Uncertainty) / Nominals[cls]) + _halfWidth[cls];
        }
        else
        {
            var z = Z(cls, o);
            var room = _halfWidth[cls] - (o.Uncertainty / o.Value);
            (left, right) = (z - room, z + room);
        }

        return left <= right ? new SweepItem(cls, left, right, o, kind) : null;
    }
}
