using MathNet.Numerics.LinearAlgebra;

namespace SortRig.Planning.Networks;

/// <summary>
/// Modified nodal analysis of a <see cref="Netlist"/> (Ho, Ruehli and Brennan, IEEE Trans. Circuits Syst. 22(6), 1975):
/// unknowns are the non-ground node voltages, then one current per voltage source, then one per ideal op-amp.
/// </summary>
internal sealed class MnaSystem
{
    private readonly Dictionary<string, int> _nodes = new(StringComparer.Ordinal);

    public MnaSystem(Netlist netlist)
    {
        Netlist = netlist;
        foreach (var n in netlist.Nodes)
        {
            if (n != netlist.Ground)
            {
                _nodes[n] = _nodes.Count;
            }
        }

        Size = _nodes.Count + netlist.Sources.Count + netlist.Amplifiers.Count;
        ResistorNodes = netlist.Resistors.Select(r => (Index(r.NodeA), Index(r.NodeB))).ToArray();
    }

    public Netlist Netlist { get; }

    public int Size { get; }

    /// <summary>Node indices (-1 for ground) of each resistor, in netlist order.</summary>
    public (int A, int B)[] ResistorNodes { get; }

    /// <summary>Index of a node's voltage in the unknown vector; -1 for ground.</summary>
    public int Index(string node) => node == Netlist.Ground ? -1 : _nodes[node];

    /// <summary>The MNA matrix for the given resistances (ohms, netlist order).</summary>
    public Matrix<double> Matrix(ReadOnlySpan<double> resistances)
    {
        var a = Matrix<double>.Build.Dense(Size, Size);
        for (var r = 0; r < resistances.Length; r++)
        {
            var g = 1.0 / resistances[r];
            var (i, j) = ResistorNodes[r];
            Add(a, i, i, g);
            Add(a, j, j, g);
            Add(a, i, j, -g);
            Add(a, j, i, -g);
        }

        var row = _nodes.Count;
        foreach (var s in Netlist.Sources)
        {
            Add(a, row, Index(s.Plus), 1.0);
            Add(a, row, Index(s.Minus), -1.0);
            Add(a, Index(s.Plus), row, 1.0);
            Add(a, Index(s.Minus), row, -1.0);
            row++;
        }

        foreach (var amp in Netlist.Amplifiers)
        {
            // The output current is a free unknown entering KCL at the output node; the row forces V+ = V-.
            Add(a, Index(amp.Output), row, 1.0);
            Add(a, row, Index(amp.Plus), 1.0);
            Add(a, row, Index(amp.Minus), -1.0);
            row++;
        }

        return a;
    }

    /// <summary>The right-hand side: source voltages, with per-source overrides (volts by name).</summary>
    public Vector<double> Rhs(IReadOnlyDictionary<string, double>? drive)
    {
        var b = Vector<double>.Build.Dense(Size);
        var row = _nodes.Count;
        foreach (var s in Netlist.Sources)
        {
            b[row++] = drive is not null && drive.TryGetValue(s.Name, out var v) ? v : s.Volts;
        }

        return b;
    }

    /// <summary>Coefficient vector c with c·x = V(plus) - V(minus).</summary>
    public Vector<double> Probe(string plus, string? minus)
    {
        var c = Vector<double>.Build.Dense(Size);
        if (Index(plus) is var p and >= 0)
        {
            c[p] += 1.0;
        }

        if (minus is not null && Index(minus) is var m and >= 0)
        {
            c[m] -= 1.0;
        }

        return c;
    }

    private static void Add(Matrix<double> a, int i, int j, double v)
    {
        if (i >= 0 && j >= 0)
        {
            a[i, j] += v;
        }
    }
}
