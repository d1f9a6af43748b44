using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace SortRig.Planning.Recipes;

/// <summary>Reads recipe YAML (our own format, see docs/planning.md) into a validated <see cref="Recipe"/>.</summary>
public static class RecipeLoader
{
    /// <summary>Field path of errors about the YAML text itself rather than a field.</summary>
    public const string Document = "(document)";

    /// <summary>Parses and validates a recipe. No I/O.</summary>
    /// <param name="yaml">The recipe text.</param>
    /// <param name="fileName">Name used in error messages.</param>
    /// <exception cref="RecipeException">The text is not valid YAML or not a valid recipe, or breaks <see
    /// cref="RecipeLimits"/>; names line, column and field.</exception>
    public static Recipe Load(string yaml, string fileName)
    {
        RecipeLimits.Check(yaml, fileName);
        var stream = new YamlStream();
        var scanner = new Scanner(new StringReader(yaml), skipComments: true);
        try
        {
            stream.Load(new Parser(scanner));
        }
        catch (YamlException e)
        {
            throw new RecipeException(
                fileName,
                (int)e.Start.Line,
                (int)e.Start.Column,
                Document,
                "well-formed YAML: " + e.Message,
                e
            );
        }
        catch (Exception e) when (e is InvalidOperationException or ArgumentException)
        {
            // YamlDotNet 18 throws these (not YamlException) on some malformed input, e.g. a byte-order mark inside a
            // plain scalar or a tab where a key should start; the scanner's position says where it stopped.
            var at = scanner.CurrentPosition;
            throw new RecipeException(
                fileName,
                Math.Max(1, (int)at.Line),
                Math.Max(1, (int)at.Column),
                Document,
                "well-formed YAML: the YAML reader stopped here (" + e.Message + ")",
                e
            );
        }

        if (stream.Documents.Count != 1)
        {
            throw new RecipeException(fileName, 1, 1, Document, "exactly one YAML document");
        }

        var root = new YamlCursor(stream.Documents[0].RootNode, "", fileName);
        root.Map();
        var form = root.Required("form", "'matched' or 'network'");
        return form.Text() switch
        {
            "matched" => ReadMatched(root),
            "network" => NetworkFormReader.Read(root),
            _ => throw form.Error("'matched' or 'network'"),
        };
    }

    /// <summary>Edge helper: reads a recipe file and loads it (the only file I/O of the planning layer).</summary>
    public static async Task<Recipe> LoadFileAsync(string path, CancellationToken cancellationToken)
    {
        var text = await RecipeLimits.ReadAsync(path, cancellationToken).ConfigureAwait(false);
        return Load(text, path);
    }

    private static Recipe ReadMatched(YamlCursor root)
    {
        root.AllowOnly("recipe", "description", "form", "match-ppm", "base", "positions");
        var ppm = root.Required("match-ppm", "a ratio tolerance in ppm")
            .Number(1e-3, 1e5, "a ratio tolerance in ppm, 0.001 to 100000");
        var positions = ReadPositions(root, network: false);
        return new Recipe(Name(root), Description(root), RecipeForm.Matched, positions, ppm, null, [], root.File);
    }

    internal static string Name(YamlCursor root) => root.Required("recipe", "the recipe's name").Text();

    internal static string? Description(YamlCursor root) => root.Optional("description")?.Text(multiline: true);

    internal static IReadOnlyList<PositionSpec> ReadPositions(YamlCursor root, bool network)
    {
        var baseValue = root.Optional("base")?.Resistance();
        var list = root.Required("positions", "a list of positions");
        var items = list.Items();
        if (items.Count == 0)
        {
            throw list.Error("at least one position");
        }

        var result = new List<PositionSpec>();
        foreach (var item in items)
        {
            item.AllowOnly(
                network ? ["name", "nominal", "ratio", "pairs", "between"] : ["name", "nominal", "ratio", "pairs"]
            );
            var nameNode = item.Required("name", "a position name");
            var name = nameNode.Text();
            if (result.Any(p => p.Name == name))
            {
                throw nameNode.Error($"a position name not used before ('{name}' is repeated)");
            }

            var nominal = ReadNominal(item, baseValue);
            var pairs = ReadPairs(item.Optional("pairs"));
            string? a = null,
                b = null;
            if (network)
            {
                var between = item.Required("between", "two node names, e.g. [in, out]");
                var nodes = between.Items();
                if (nodes.Count != 2 || nodes[0].Text() == nodes[1].Text())
                {
                    throw between.Error("two different node names, e.g. [in, out]");
                }

                (a, b) = (nodes[0].Text(), nodes[1].Text());
            }

            result.Add(new PositionSpec(name, nominal, pairs, a, b));
        }

        return result;
    }

    private static double ReadNominal(YamlCursor item, double? baseValue)
    {
        var nominal = item.Optional("nominal");
        var ratio = item.Optional("ratio");
        if ((nominal is null) == (ratio is null))
        {
            throw item.Error("exactly one of 'nominal' (ohms) or 'ratio' (times the recipe's base)");
        }

        if (nominal is not null)
        {
            return nominal.Resistance();
        }

        var r = ratio!.Number(1e-6, 1e6, "a ratio > 0 (times the recipe's base)");
        if (baseValue is not { } b)
        {
            throw ratio.Error("a top-level 'base' resistance for 'ratio' to multiply");
        }

        // A large base times a large ratio leaves the range a position may have: the product must still be a
        // resistance.
        var ohms = r * b;
        return YamlCursor.IsResistance(ohms)
            ? ohms
            : throw ratio.Error(
                FormattableString.Invariant($"a ratio that with base {b:G6} ohms gives 1e-6 to 1e15 ohms")
            );
    }

    private static PairBuilds ReadPairs(YamlCursor? node)
    {
        var result = PairBuilds.None;
        foreach (var item in node?.Items() ?? [])
        {
            result |= item.Text() switch
            {
                "series" => PairBuilds.Series,
                "parallel" => PairBuilds.Parallel,
                _ => throw item.Error("'series' or 'parallel'"),
            };
        }

        return result;
    }
}
