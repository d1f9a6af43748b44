using YamlDotNet.RepresentationModel;

namespace SortRig.Instruments.Profiles;

/// <summary>A YAML mapping whose keys were checked against the allowed set on construction.</summary>
internal sealed class YamlMap
{
    private readonly Dictionary<string, YamlField> _fields = new(StringComparer.Ordinal);
    private readonly YamlMappingNode _node;
    private readonly string _file;
    private readonly string _path;

    public YamlMap(YamlMappingNode node, string file, string path, IReadOnlyCollection<string> allowedKeys)
    {
        _node = node;
        _file = file;
        _path = path;
        foreach (var (keyNode, valueNode) in node.Children)
        {
            var key = (keyNode as YamlScalarNode)?.Value ?? string.Empty;
            var field = new YamlField(valueNode, file, path.Length == 0 ? key : $"{path}.{key}");
            if (!allowedKeys.Contains(key))
            {
                throw new YamlField(keyNode, file, field.Path).Error(
                    $"unknown key '{key}'",
                    $"one of {string.Join(", ", allowedKeys)}"
                );
            }

            _fields[key] = field;
        }
    }

    public bool Has(string key) => _fields.ContainsKey(key);

    public YamlField? Optional(string key) => _fields.TryGetValue(key, out var f) ? f : null;

    public YamlField Required(string key, string expected) =>
        _fields.TryGetValue(key, out var f)
            ? f
            : throw new ProfileException(
                _file,
                (int)_node.Start.Line,
                (int)_node.Start.Column,
                _path.Length == 0 ? key : $"{_path}.{key}",
                "is missing",
                expected
            );
}
