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
        new(File, (int)Node.Start.Line, (int)Node.Start.Column, Path.Length == 0 ? TopLevel : Path, expected);

    /// <summary>Field path shown for the document's root node.</summary>
    public const string TopLevel = "(top level)";

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
        Optional(key)
        ?? throw new RecipeException(
            File,
            (int)Node.Start.Line,
            (int)Node.Start.Column,
            Join(key),
            $"{expected} (field is missing)"
        );

    public void AllowOnly(params string[] keys)
    {
        foreach (var k in Map().Children.Keys)
        {
            var name = (k as YamlScalarNode)?.Value ?? "";
            if (!keys.Contains(name, StringComparer.Ordinal))
            {
                // A blank or non-text key (e.g. a list used as a key) still gets a path that says where it is.
                var shown = string.IsNullOrWhiteSpace(name) ? "(blank or non-text key)" : name;
                throw new YamlCursor(k, Join(shown), File).Error("one of the fields " + string.Join(", ", keys));
            }
        }
    }

    /// <summary>
    /// The scalar's text. Names, nodes and numbers never hold a control character (a newline would forge a line in a
    /// log or a CSV, an escape sequence would drive the terminal); a description may span lines and hold tabs.
    /// </summary>
    public string Text(bool multiline = false)
    {
        if (Node is not YamlScalarNode { Value: { Length: > 0 } v })
        {
            throw Error("a non-empty text value");
        }

        var bad = v.IndexOfAny(ControlCharacters(multiline));
        if (bad >= 0)
        {
            throw Error(
                string.Create(
                    CultureInfo.InvariantCulture,
                    $"text without control characters (U+{(int)v[bad]:X4} at character {bad + 1})"
                )
            );
        }

        return v;
    }

    private static readonly char[] s_control =
    [
        .. Enumerable.Range(0, 0xA0).Select(i => (char)i).Where(char.IsControl),
    ];
    private static readonly char[] s_controlButLines = [.. s_control.Where(c => c is not ('\n' or '\t' or '\r'))];

    private static char[] ControlCharacters(bool multiline) => multiline ? s_controlButLines : s_control;

    public double Number(double min, double max, string expected)
    {
        if (
            !double.TryParse(Text(), NumberStyles.Float, CultureInfo.InvariantCulture, out var x)
            || !(x >= min && x <= max)
        )
        {
            throw Error(expected);
        }

        return x;
    }

    /// <summary>A resistance in ohms: a number, optionally with an SI suffix R, k or M ("4k99" is not accepted; "4.99k"
    /// is).</summary>
    public double Resistance()
    {
        const string Expected = "a resistance in ohms from 1e-6 to 1e15, e.g. 10k, 4.99k, 1M or 100";
        var t = Text().Trim();
        if (t.Length == 0)
        {
            throw Error(Expected);
        }

        var scale = t[^1] switch
        {
            'k' or 'K' => 1e3,
            'M' => 1e6,
            'R' or 'r' => 1.0,
            _ => 0.0,
        };
        var digits = scale == 0.0 ? t : t[..^1];
        // The suffix may overflow a finite mantissa ("1e308M"), so the scaled value is what is checked.
        var ohms = double.TryParse(digits, NumberStyles.Float, CultureInfo.InvariantCulture, out var x)
            ? x * (scale == 0.0 ? 1.0 : scale)
            : double.NaN;
        if (!IsResistance(ohms))
        {
            throw Error(Expected);
        }

        return ohms;
    }

    /// <summary>
    /// True for a resistance the solver handles: 1 µOhm to 1 POhm. Outside it (a denormal "1e-320", an overflowing
    /// "1e308M") sensitivities ~ 1/R² are no longer finite.
    /// </summary>
    public static bool IsResistance(double ohms) => ohms >= 1e-6 && ohms <= 1e15;

    private string Join(string key) => Path.Length == 0 ? key : $"{Path}.{key}";
}
