using SortRig.Planning.Networks;

namespace SortRig.Planning.Recipes;

/// <summary>Reads the full (network) form: ground, sources, amplifiers, positions between nodes, outputs.</summary>
internal static class NetworkFormReader
{
    public static Recipe Read(YamlCursor root)
    {
        root.AllowOnly(
            "recipe",
            "description",
            "form",
            "ground",
            "base",
            "sources",
            "amplifiers",
            "positions",
            "outputs"
        );
        var ground = root.Required("ground", "the ground node's name").Text();
        var sources = ReadSources(root);
        var amplifiers = ReadAmplifiers(root);
        var positions = RecipeLoader.ReadPositions(root, network: true);
        var netlist = new Netlist(
            ground,
            positions.Select(p => new NetResistor(p.Name, p.NodeA!, p.NodeB!)).ToList(),
            sources,
            amplifiers
        );
        var outputsNode = root.Required("outputs", "a list of output specs");
        var outputs = OutputReader.Read(outputsNode, netlist, positions);
        var recipe = new Recipe(
            RecipeLoader.Name(root),
            RecipeLoader.Description(root),
            RecipeForm.Network,
            positions,
            0,
            netlist,
            outputs,
            root.File
        );
        RecipeChecks.CheckSolvable(recipe, root, outputsNode);
        return recipe;
    }

    private static List<NetSource> ReadSources(YamlCursor root)
    {
        var node = root.Required("sources", "a list of voltage sources");
        var result = new List<NetSource>();
        foreach (var item in node.Items())
        {
            item.AllowOnly("name", "plus", "minus", "volts");
            var nameNode = item.Required("name", "a source name");
            if (result.Any(s => s.Name == nameNode.Text()))
            {
                throw nameNode.Error($"a source name not used before ('{nameNode.Text()}' is repeated)");
            }

            var plus = item.Required("plus", "the node at the source's + terminal").Text();
            var minus = item.Required("minus", "the node at the source's - terminal").Text();
            if (plus == minus)
            {
                throw item.Error("different nodes for 'plus' and 'minus'");
            }

            var volts = item.Required("volts", "the source voltage in volts")
                .Number(-1e4, 1e4, "a voltage in volts, -10000 to 10000");
            result.Add(new NetSource(nameNode.Text(), plus, minus, volts));
        }

        if (result.Count == 0)
        {
            throw node.Error("at least one voltage source");
        }

        return result;
    }

    private static List<NetAmplifier> ReadAmplifiers(YamlCursor root)
    {
        var result = new List<NetAmplifier>();
        foreach (var item in root.Optional("amplifiers")?.Items() ?? [])
        {
            item.AllowOnly("name", "plus", "minus", "output");
            result.Add(
                new NetAmplifier(
                    item.Required("name", "an amplifier name").Text(),
                    item.Required("plus", "the non-inverting input node").Text(),
                    item.Required("minus", "the inverting input node").Text(),
                    item.Required("output", "the output node").Text()
                )
            );
        }

        return result;
    }
}
