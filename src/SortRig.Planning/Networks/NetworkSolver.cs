using SortRig.Planning.Recipes;

namespace SortRig.Planning.Networks;

/// <summary>Node voltages of a solved network, and the sensitivity of any probe to every resistor.</summary>
/// <param name="NodeVoltages">Voltage of every node to ground, volts (ground included, 0).</param>
/// <param name="Sensitivities">For each probe asked for: dV/dR per resistor name, volts per ohm.</param>
public sealed record NetworkSolution(
    IReadOnlyDictionary<string, double> NodeVoltages,
    IReadOnlyDictionary<NodeProbe, IReadOnlyDictionary<string, double>> Sensitivities
)
{
    /// <summary>V(plus) − V(minus) of a probe, volts.</summary>
    public double Voltage(NodeProbe probe) =>
        NodeVoltages[probe.Plus] - (probe.Minus is null ? 0.0 : NodeVoltages[probe.Minus]);
}

/// <summary>Solves a DC netlist by modified nodal analysis (dense LU from MathNet.Numerics). Pure
/// computation.</summary>
public static class NetworkSolver
{
    /// <summary>Solves the network.</summary>
    /// <param name="netlist">The circuit.</param>
    /// <param name="resistances">Value of every resistor by name, ohms (&gt; 0).</param>
    /// <param name="drive">Source voltages overriding the netlist's, volts by source name; null for none.</param>
    /// <param name="probes">Probes whose sensitivities to every resistor are wanted (adjoint method); null for
    /// none.</param>
    /// <exception cref="ArgumentException">A resistor has no value or a value that is not finite and &gt;
    /// 0.</exception>
    /// <exception cref="InvalidOperationException">The network is singular (floating node, source loop).</exception>
    public static NetworkSolution Solve(
        Netlist netlist,
        IReadOnlyDictionary<string, double> resistances,
        IReadOnlyDictionary<string, double>? drive = null,
        IReadOnlyList<NodeProbe>? probes = null
    )
    {
        var system = new MnaSystem(netlist);
        var values = netlist
            .Resistors.Select(r =>
                resistances.TryGetValue(r.Name, out var v) && v > 0 && double.IsFinite(v)
                    ? v
                    : throw new ArgumentException(
                        $"resistor '{r.Name}' needs a finite value > 0 ohms",
                        nameof(resistances)
                    )
            )
            .ToArray();
        var factor = new MnaFactor(system, values);
        var x = factor.Solve(drive);
        var voltages = netlist.Nodes.ToDictionary(
            n => n,
            n => system.Index(n) is var i and >= 0 ? x[i] : 0.0,
            StringComparer.Ordinal
        );
        var sens = new Dictionary<NodeProbe, IReadOnlyDictionary<string, double>>();
        foreach (var p in probes ?? [])
        {
            var g = factor.Gradient(system.Probe(p.Plus, p.Minus), x);
            sens[p] = netlist
                .Resistors.Select((r, k) => (r.Name, g[k]))
                .ToDictionary(t => t.Name, t => t.Item2, StringComparer.Ordinal);
        }

        return new NetworkSolution(voltages, sens);
    }
}
