using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Assembly;

/// <summary>The verdict on one complete assignment.</summary>
/// <param name="Meets">Every spec met in the worst case.</param>
/// <param name="Score">Largest worst-case error over tolerance (the tie-break; smaller is better).</param>
/// <param name="Checks">Every output judged.</param>
internal sealed record SetVerdict(bool Meets, double Score, OutputCheck[] Checks);

/// <summary>Judges a complete assignment (one option per position, recipe order).</summary>
internal interface ISetRule
{
    SetVerdict Judge(ReadOnlySpan<Option> fills);
}

/// <summary>
/// Matched form: with q = value/nominal, the worst-case ratio spread max((x+U)/n) / min((x−U)/n) − 1 must not exceed
/// the match tolerance; this is the largest ratio error between any two positions with every part at the edge of its
/// expanded transfer uncertainty.
/// </summary>
internal sealed class MatchedRule(Recipe recipe) : ISetRule
{
    private readonly double[] _nominals = recipe.Positions.Select(p => p.Nominal).ToArray();

    public double TolerancePpm { get; } = recipe.MatchTolerancePpm;

    /// <summary>Window in log units: a set is feasible iff max Hi − min Lo ≤ Window.</summary>
    public double Window => Math.Log(1 + (TolerancePpm * 1e-6));

    public double Lo(int position, Option o) =>
        o.Value > o.Uncertainty ? Math.Log((o.Value - o.Uncertainty) / _nominals[position]) : double.NegativeInfinity;

    public double Hi(int position, Option o) => Math.Log((o.Value + o.Uncertainty) / _nominals[position]);

    public SetVerdict Judge(ReadOnlySpan<Option> fills)
    {
        double qMax = double.MinValue,
            qMin = double.MaxValue,
            hi = double.MinValue,
            lo = double.MaxValue;
        for (var k = 0; k < fills.Length; k++)
        {
            var n = _nominals[k];
            qMax = Math.Max(qMax, fills[k].Value / n);
            qMin = Math.Min(qMin, fills[k].Value / n);
            hi = Math.Max(hi, (fills[k].Value + fills[k].Uncertainty) / n);
            lo = Math.Min(lo, (fills[k].Value - fills[k].Uncertainty) / n);
        }

        var spread = ((qMax / qMin) - 1) * 1e6;
        var worst = lo > 0 ? ((hi / lo) - 1) * 1e6 : double.PositiveInfinity;
        var check = new OutputCheck("ratio-match", spread, 0, spread, worst, TolerancePpm, "ppm");
        return new SetVerdict(check.Meets, check.Score, [check]);
    }
}

/// <summary>Network form: every output within its tolerance in the worst case (linearised uncertainty).</summary>
internal sealed class NetworkRule(Recipe recipe) : ISetRule
{
    public RecipeNetwork Network { get; } = new(recipe);

    public SetVerdict Judge(ReadOnlySpan<Option> fills)
    {
        var values = new double[fills.Length];
        var u = new double[fills.Length];
        for (var k = 0; k < fills.Length; k++)
        {
            values[k] = fills[k].Value;
            u[k] = fills[k].Uncertainty;
        }

        var checks = NetworkEvaluator.Checks(recipe, Network.Evaluate(values), u);
        return new SetVerdict(checks.All(c => c.Meets), checks.Max(c => c.Score), checks);
    }
}
