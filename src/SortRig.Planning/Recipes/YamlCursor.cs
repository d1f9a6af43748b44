using System.Globalization;
using YamlDotNet.RepresentationModel;

namespace SortRig.Planning.Recipes;

/// <summary>A YAML node with its field path and file, so every error can name file, line, column and field.</summary>
internal sealed class YamlCursor(YamlNode node, string path, string file)
{
    public YamlNode Node { get; } = node;

    public string Path { get; } = path;

    public string File { get; } = file;

    public RecipeException Error(string expected) =>
        new(File, (int)Node.Start.Line, (int)Node.Start.Column, Path, expected);

    public YamlMappingNode Map() => Node as YamlMappingNode ?? throw Error("a mapping of fields");

    public IReadOnlyList<YamlCursor> Items()
    {
        if (Node is not YamlSequenceNode seq)
        {
            throw Error("a list");
        }

        return seq.Children.Select((c, i) => new YamlCursor(c, $"{Path}[{i}]", File)).ToList();
    }

    public YamlCursor? Optional(string key)
    {
        foreach (var (k, v) in Map().Children)
        {
            if (k is YamlScalarNode s && s.Value == key)
            {
                return new YamlCursor(v, Join(key), File);
            }
        }

        return null;
    }

    public YamlCursor Required(string key, string expected) =>
        Optional(key) ?? throw new RecipeException(File, (int)Node.Start.Line, (int)Node.Start.Column, Join(key), $"{expected} (field is missing)");

    public void AllowOnly(params string[] keys)
    {
        foreach (var k in Map().Children.Keys)
        {
            var name = (k as YamlScalarNode)?.Value ?? "";
            if (!keys.Contains(name, StringComparer.Ordinal))
            {
                throw new YamlCursor(k, Join(name), File).Error("one of the fields " + string.Join(", ", keys));
            }
        }
    }

    public string Text()
    {
        if (Node is not YamlScalarNode { Value: { Length: > 0 } v })
        {
            throw Error("a non-empty text value");
        }

        return v;
    }

    public double Number(double min, double max, string expected)
    {
        if (!double.TryParse(Text(), NumberStyles.Float, CultureInfo.InvariantCulture, out var x) || !(x >= min && x <= max))
        {
            throw Error(expected);
        }

        return x;
    }

    /// <summary>A resistance in ohms: a number, optionally with an SI suffix R, k or M ("4k99" is not accepted; "4.99k" is).</summary>
    public double Resistance()
    {
        var t = Text().Trim();
        var scale = t[^1] switch { 'k' or 'K' => 1e3, 'M' => 1e6, 'R' or 'r' => 1.0, _ => 0.0 };
        var digits = scale == 0.0 ? t : t[..^1];
        if (!double.TryParse(digits, NumberStyles.Float, CultureInfo.InvariantCulture, out var x) || !(x > 0) || double.IsInfinity(x))
        {
            throw Error("a resistance in ohms > 0, e.g. 10k, 4.99k, 1M or 100");
        }

        return x * (scale == 0.0 ? 1.0 : scale);
    }

    private string Join(string key) => Path.Length == 0 ? key : $"{Path}.{key}";
}
