using System.Globalization;
using YamlDotNet.Core;
using YamlDotNet.RepresentationModel;

namespace SortRig.Instruments.Profiles;

/// <summary>A YAML node with its file and dotted field path, converting itself to typed values.</summary>
internal readonly record struct YamlField(YamlNode Node, string File, string Path)
{
    public ProfileException Error(string problem, string expected) =>
        new(File, (int)Node.Start.Line, (int)Node.Start.Column, Path, problem, expected);

    public YamlMap AsMap(params string[] allowedKeys) =>
        Node is YamlMappingNode map
            ? new YamlMap(map, File, Path, allowedKeys)
            : throw Error($"is {Describe()}", "a mapping of key: value lines");

    public IReadOnlyList<YamlField> AsList(int minCount)
    {
        if (Node is not YamlSequenceNode seq)
        {
            throw Error($"is {Describe()}", "a list");
        }

        if (seq.Children.Count < minCount)
        {
            throw Error($"has {seq.Children.Count} items", $"at least {minCount}");
        }

        var file = File;
        var path = Path;
        return [.. seq.Children.Select((n, i) => new YamlField(n, file, $"{path}[{i}]"))];
    }

    public string AsString()
    {
        var scalar = Scalar("a text");
        return scalar.Value is { Length: > 0 } s ? s : throw Error("is empty", "a text");
    }

    public double AsDouble(double min, double max, string unit)
    {
        var expected = $"a number {Format(min)} to {Format(max)}{unit}";
        var scalar = Scalar(expected);
        if (
            scalar.Style != ScalarStyle.Plain
            || !double.TryParse(scalar.Value, NumberStyles.Float, CultureInfo.InvariantCulture, out var value)
            || !double.IsFinite(value)
        )
        {
            throw Error($"'{scalar.Value}' is not a number", expected);
        }

        return value >= min && value <= max ? value : throw Error($"{Format(value)} is out of range", expected);
    }

    public int AsInt(int min, int max, string unit)
    {
        var value = AsDouble(min, max, unit);
        return value == Math.Floor(value)
            ? (int)value
            : throw Error($"{Format(value)} is not a whole number", $"a whole number {min} to {max}{unit}");
    }

    public bool AsBool()
    {
        var scalar = Scalar("true or false");
        return scalar.Style == ScalarStyle.Plain && scalar.Value is "true" or "false"
            ? scalar.Value == "true"
            : throw Error($"'{scalar.Value}' is not a boolean", "true or false");
    }

    private YamlScalarNode Scalar(string expected) =>
        Node as YamlScalarNode ?? throw Error($"is {Describe()}", expected);

    private string Describe() =>
        Node switch
        {
            YamlMappingNode => "a mapping",
            YamlSequenceNode => "a list",
            YamlScalarNode s => $"'{s.Value}'",
            _ => "an alias",
        };

    private static string Format(double v) => v.ToString("G6", CultureInfo.InvariantCulture);
}
