using SortRig.Planning.Networks;

namespace SortRig.Planning.Recipes;

/// <summary>Reads the output specs of a network recipe.</summary>
internal static class OutputReader
{
    private static readonly string[] s_kinds = ["node-voltage", "voltage-ratio", "gain", "position-ratio"];

    public static IReadOnlyList<OutputSpec> Read(
        YamlCursor list,
        Netlist netlist,
        IReadOnlyList<PositionSpec> positions
    )
    {
        var result = new List<OutputSpec>();
        var items = list.Items();
        if (items.Count == 0)
        {
            throw list.Error("at least one output spec");
        }

        foreach (var item in items)
        {
            var nameNode = item.Required("name", "an output name");
            if (result.Any(o => o.Name == nameNode.Text()))
            {
                throw nameNode.Error($"an output name not used before ('{nameNode.Text()}' is repeated)");
            }

            var kindNode = item.Required("kind", "one of " + string.Join(", ", s_kinds));
            var name = nameNode.Text();
            OutputSpec spec = kindNode.Text() switch
            {
                "node-voltage" => NodeVoltage(item, name, netlist),
                "voltage-ratio" => Ratio(item, name, netlist, "numerator", "denominator"),
                "gain" => Ratio(item, name, netlist, "output", "input"),
                "position-ratio" => PositionRatio(item, name, positions),
                _ => throw kindNode.Error("one of " + string.Join(", ", s_kinds)),
            };
            result.Add(spec);
        }

        return result;
    }

    private static NodeVoltageSpec NodeVoltage(YamlCursor item, string name, Netlist netlist)
    {
        item.AllowOnly("name", "kind", "node", "target-volts", "tolerance-mv", "drive");
        var probe = Probe(item.Required("node", "a node name or 'a - b'"), netlist);
        var target = item.Optional("target-volts")?.Number(-1e4, 1e4, "a target voltage in volts");
        var tol = item.Required("tolerance-mv", "a tolerance in mV").Number(1e-6, 1e6, "a tolerance in mV, > 0");
        return new NodeVoltageSpec(name, Drive(item, netlist), probe, target, tol / 1000.0);
    }

    private static VoltageRatioSpec Ratio(YamlCursor item, string name, Netlist netlist, string num, string den)
    {
        item.AllowOnly("name", "kind", num, den, "target", "tolerance-ppm", "drive");
        var n = Probe(item.Required(num, "a node name or 'a - b'"), netlist);
        var d = Probe(item.Required(den, "a node name or 'a - b'"), netlist);
        var targetNode = item.Optional("target");
        var target = targetNode?.Number(-1e9, 1e9, "a non-zero target ratio");
        if (target == 0)
        {
            throw targetNode!.Error("a non-zero target ratio");
        }

        var tol = item.Required("tolerance-ppm", "a tolerance in ppm").Number(1e-6, 1e6, "a tolerance in ppm, > 0");
        return new VoltageRatioSpec(name, Drive(item, netlist), n, d, target, tol);
    }

    private static PositionRatioSpec PositionRatio(YamlCursor item, string name, IReadOnlyList<PositionSpec> positions)
    {
        item.AllowOnly("name", "kind", "numerator", "denominator", "tolerance-ppm");
        string Position(string key)
        {
            var node = item.Required(key, "a position name");
            return positions.Any(p => p.Name == node.Text())
                ? node.Text()
                : throw node.Error("the name of a position of this recipe");
        }

        var tol = item.Required("tolerance-ppm", "a tolerance in ppm").Number(1e-6, 1e6, "a tolerance in ppm, > 0");
        return new PositionRatioSpec(name, Position("numerator"), Position("denominator"), tol);
    }

    private static NodeProbe Probe(YamlCursor node, Netlist netlist)
    {
        var parts = node.Text().Split(" - ", StringSplitOptions.TrimEntries);
        if (parts.Length > 2 || parts.Any(p => !netlist.Nodes.Contains(p, StringComparer.Ordinal)))
        {
            throw node.Error(
                "a node of the netlist or 'a - b' of two nodes (known: " + string.Join(", ", netlist.Nodes) + ")"
            );
        }

        return new NodeProbe(parts[0], parts.Length == 2 ? parts[1] : null);
    }

    private static Dictionary<string, double> Drive(YamlCursor item, Netlist netlist)
    {
        var result = new Dictionary<string, double>(StringComparer.Ordinal);
        var drive = item.Optional("drive");
        if (drive is null)
        {
            return result;
        }

        foreach (var source in netlist.Sources)
        {
            if (drive.Optional(source.Name) is { } v)
            {
                result[source.Name] = v.Number(-1e4, 1e4, "a source voltage in volts");
            }
        }

        drive.AllowOnly(netlist.Sources.Select(s => s.Name).ToArray());
        return result;
    }
}
