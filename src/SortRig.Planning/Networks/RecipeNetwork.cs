using SortRig.Planning.Recipes;

namespace SortRig.Planning.Networks;

/// <summary>A value of one output for one set of position values, with d(Error)/dR for every position.</summary>
internal readonly record struct OutputValue(
    double Value,
    double Target,
    double Error,
    double[] ErrorGradient,
    double Tolerance,
    string Unit
);

/// <summary>Evaluates a network recipe's outputs for position values (positions in recipe order = netlist
/// order).</summary>
internal sealed class RecipeNetwork
{
    private readonly MnaSystem _system;
    private readonly Recipe _recipe;
    private readonly double[] _targets;

    public RecipeNetwork(Recipe recipe)
    {
        _recipe = recipe;
        _system = new MnaSystem(recipe.Network ?? throw new ArgumentException("recipe has no network", nameof(recipe)));
        var nominal = recipe.Positions.Select(p => p.Nominal).ToArray();
        var raw = Evaluate(nominal, targets: null);
        _targets = recipe.Outputs.Select((o, i) => Explicit(o) ?? raw[i].Value).ToArray();
    }

    public IReadOnlyList<OutputSpec> Outputs => _recipe.Outputs;

    public double Target(int output) => _targets[output];

    public OutputValue[] Evaluate(ReadOnlySpan<double> values) => Evaluate(values, _targets);

    /// <summary>Every output's error (as in <see cref="Evaluate(ReadOnlySpan{double})"/>) without the sensitivities:
    /// one factorisation and one solve per output, for searches that judge many value sets.</summary>
    public void Errors(ReadOnlySpan<double> values, Span<double> errors)
    {
        var factor = new MnaFactor(_system, values);
        for (var i = 0; i < errors.Length; i++)
        {
            var t = _targets[i];
            errors[i] = _recipe.Outputs[i] switch
            {
                NodeVoltageSpec s => (_system.Probe(s.Node.Plus, s.Node.Minus) * factor.Solve(s.Drive)) - t,
                VoltageRatioSpec s => RatioError(factor, s, t),
                PositionRatioSpec s => (values[IndexOf(s.Numerator)] / values[IndexOf(s.Denominator)] - t)
                    * 1e6
                    / Math.Abs(t),
                _ => throw new InvalidOperationException("unknown output kind"),
            };
        }
    }

    private double RatioError(MnaFactor f, VoltageRatioSpec s, double t)
    {
        var x = f.Solve(s.Drive);
        var y =
            (_system.Probe(s.Numerator.Plus, s.Numerator.Minus) * x)
            / (_system.Probe(s.Denominator.Plus, s.Denominator.Minus) * x);
        return (y - t) * 1e6 / Math.Abs(t);
    }

    private OutputValue[] Evaluate(ReadOnlySpan<double> values, double[]? targets)
    {
        var factor = new MnaFactor(_system, values);
        var result = new OutputValue[_recipe.Outputs.Count];
        for (var i = 0; i < result.Length; i++)
        {
            var t = targets?[i];
            result[i] = _recipe.Outputs[i] switch
            {
                NodeVoltageSpec s => NodeVoltage(factor, s, t),
                VoltageRatioSpec s => Ratio(factor, s, t),
                PositionRatioSpec s => PositionRatio(values, s, t),
                _ => throw new InvalidOperationException("unknown output kind"),
            };
        }

        return result;
    }

    private OutputValue NodeVoltage(MnaFactor f, NodeVoltageSpec s, double? target)
    {
        var x = f.Solve(s.Drive);
        var c = _system.Probe(s.Node.Plus, s.Node.Minus);
        var v = c * x;
        var t = target ?? v;
        return new OutputValue(v, t, v - t, f.Gradient(c, x), s.ToleranceVolts, "V");
    }

    private OutputValue Ratio(MnaFactor f, VoltageRatioSpec s, double? target)
    {
        var x = f.Solve(s.Drive);
        var cn = _system.Probe(s.Numerator.Plus, s.Numerator.Minus);
        var cd = _system.Probe(s.Denominator.Plus, s.Denominator.Minus);
        var d = cd * x;
        var y = (cn * x) / d;
        var t = target ?? y;
        // d(N/D) = (dN − y dD) / D: one adjoint solve with the combined functional.
        var grad = f.Gradient((cn - (y * cd)) / d, x);
        var scale = 1e6 / Math.Abs(t);
        return new OutputValue(y, t, (y - t) * scale, grad.Select(g => g * scale).ToArray(), s.TolerancePpm, "ppm");
    }

    private OutputValue PositionRatio(ReadOnlySpan<double> values, PositionRatioSpec s, double? target)
    {
        var a = IndexOf(s.Numerator);
        var b = IndexOf(s.Denominator);
        var y = values[a] / values[b];
        var t = target ?? y;
        var scale = 1e6 / Math.Abs(t);
        var grad = new double[values.Length];
        grad[a] += scale / values[b];
        grad[b] -= scale * values[a] / (values[b] * values[b]);
        return new OutputValue(y, t, (y - t) * scale, grad, s.TolerancePpm, "ppm");
    }

    private int IndexOf(string position)
    {
        for (var i = 0; i < _recipe.Positions.Count; i++)
        {
            if (_recipe.Positions[i].Name == position)
            {
                return i;
            }
        }

        throw new InvalidOperationException($"no position '{position}'");
    }

    private double? Explicit(OutputSpec o) =>
        o switch
        {
            NodeVoltageSpec s => s.TargetVolts,
            VoltageRatioSpec s => s.Target,
            PositionRatioSpec s => _recipe.Positions[IndexOf(s.Numerator)].Nominal
                / _recipe.Positions[IndexOf(s.Denominator)].Nominal,
            _ => null,
        };
}
