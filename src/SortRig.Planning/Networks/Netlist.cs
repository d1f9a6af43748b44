namespace SortRig.Planning.Networks;

/// <summary>A resistor between two named nodes; its value is supplied at solve time by name.</summary>
public sealed record NetResistor(string Name, string NodeA, string NodeB);

/// <summary>An ideal voltage source: V(Plus) - V(Minus) = Volts.</summary>
public sealed record NetSource(string Name, string Plus, string Minus, double Volts);

/// <summary>An ideal operational amplifier (nullor): drives Output so that V(Plus) = V(Minus), draws no input
/// current.</summary>
public sealed record NetAmplifier(string Name, string Plus, string Minus, string Output);

/// <summary>
/// A small linear DC netlist: resistors, ideal voltage sources, ideal op-amps and one ground node (0 V).
/// </summary>
/// <param name="Ground">Name of the reference node.</param>
/// <param name="Resistors">Resistors, values given at solve time.</param>
/// <param name="Sources">Voltage sources.</param>
/// <param name="Amplifiers">Ideal op-amps; may be empty.</param>
public sealed record Netlist(
    string Ground,
    IReadOnlyList<NetResistor> Resistors,
    IReadOnlyList<NetSource> Sources,
    IReadOnlyList<NetAmplifier> Amplifiers
)
{
    /// <summary>Every node named by an element, ground included, in first-seen order.</summary>
    public IReadOnlyList<string> Nodes
    {
        get
        {
            var seen = new List<string> { Ground };
            void Add(string n)
            {
                if (!seen.Contains(n, StringComparer.Ordinal))
                {
                    seen.Add(n);
                }
            }

            foreach (var r in Resistors)
            {
                Add(r.NodeA);
                Add(r.NodeB);
            }
            foreach (var s in Sources)
            {
                Add(s.Plus);
                Add(s.Minus);
            }
            foreach (var a in Amplifiers)
            {
                Add(a.Plus);
                Add(a.Minus);
                Add(a.Output);
            }
            return seen;
        }
    }
}
