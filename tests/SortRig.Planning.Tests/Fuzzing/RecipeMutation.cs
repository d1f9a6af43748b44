using System.Text;
using System.Text.RegularExpressions;

namespace SortRig.Planning.Tests.Fuzzing;

/// <summary>Kinds of damage done to a recipe text.</summary>
public enum MutationKind
{
    DeleteLine,
    DuplicateLine,
    Reindent,
    ReplaceScalar,
    UnknownKey,
    Truncate,
    RandomBytes,
    Unclose,
    SwapLines,
    RenameKey,
    RenameNode,
    Garbage,
}

/// <summary>
/// One mutation. A, B and C are non-negative choices taken modulo the size of whatever they pick (line, token,
/// replacement), so any generated value is valid and FsCheck can shrink them.
/// </summary>
public sealed record RecipeMutation(MutationKind Kind, int A, int B, int C)
{
    private static readonly Regex s_token = new(@"[A-Za-z0-9_.+\-]+", RegexOptions.Compiled);

    /// <summary>Scalar replacements: wrong signs, zero, huge, tiny, NaN/inf spellings, empty, nulls, structures, YAML
    /// oddities.</summary>
    internal static readonly string[] Scalars =
    [
        "-1",
        "0",
        "-0",
        "1e308",
        "1e400",
        "-1e400",
        "1e308M",
        "9e307k",
        "1e-320",
        "5e-324",
        "NaN",
        ".nan",
        "nan",
        ".inf",
        "-.inf",
        "Infinity",
        "-Infinity",
        "''",
        "' '",
        "\" \"",
        "~",
        "null",
        "abc",
        "10k",
        "0k",
        "-10k",
        "1M",
        "k",
        "M",
        "R",
        "4k99",
        "10kk",
        "[]",
        "{}",
        "[a, b]",
        "{ a: 1 }",
        "'quoted'",
        "\"unterminated",
        "&anchor x",
        "*alias",
        "!!int 5",
        "!tag x",
        "0x10",
        "1_000",
        "1,5",
        "+5",
        "1e6",
        "1000000",
        "1000001",
        "0.0001",
        "1e-7",
        "gnd",
        "in",
        "R1",
        "series",
        "parallel",
        "matched",
        "network",
        "voltage-ratio",
        "gain",
        "node-voltage",
        "position-ratio",
        "a - b",
        "gnd - gnd",
        "in - t10 - t100",
        "|",
        ">",
        "- x",
        "? x",
        "%",
        "@",
        "`",
        "#",
        ": ",
        "é",
        "\t",
        new string('9', 400),
        "x" + new string('y', 2000),
    ];

    private static readonly string[] s_keys =
    [
        "recipe",
        "description",
        "form",
        "match-ppm",
        "base",
        "positions",
        "name",
        "nominal",
        "ratio",
        "pairs",
        "between",
        "ground",
        "sources",
        "plus",
        "minus",
        "volts",
        "amplifiers",
        "output",
        "outputs",
        "kind",
        "node",
        "target-volts",
        "tolerance-mv",
        "numerator",
        "denominator",
        "target",
        "tolerance-ppm",
        "input",
        "drive",
        "bogus",
        "Nominal",
        "",
    ];

    private static readonly string[] s_junk =
    [
        "\0",
        "\t",
        "{",
        "}",
        "[",
        "]",
        "\"",
        "'",
        "&",
        "*",
        "!",
        "%",
        "@",
        "`",
        "|",
        ">",
        ":",
        "-",
        "#",
        ",",
        "?",
        "\r",
        "\n",
        "\u00ff",
        "\uFEFF",
        "\uD800",
        "\u2028",
        "\x7f",
        "\x1b",
    ];

    private static readonly string[] s_nodes =
    [
        "gnd",
        "in",
        "out",
        "t10",
        "t100",
        "inp",
        "inn",
        "np",
        "nm",
        "n0",
        "n1",
        "n7",
        "b0",
        "nowhere",
    ];

    /// <summary>Applies the mutation to the lines of a recipe (modified in place).</summary>
    public void Apply(List<string> lines)
    {
        if (lines.Count == 0)
        {
            lines.Add("");
        }

        var i = A % lines.Count;
        var line = lines[i];
        switch (Kind)
        {
            case MutationKind.DeleteLine:
                lines.RemoveAt(i);
                break;
            case MutationKind.DuplicateLine:
                lines.Insert(i, line);
                break;
            case MutationKind.Reindent:
                var body = line.TrimStart(' ');
                lines[i] = (B % 5) switch
                {
                    0 => body,
                    1 => new string(' ', C % 9) + body,
                    2 => "\t" + body,
                    3 => " " + line,
                    _ => line.Length > 0 ? line[1..] : line,
                };
                break;
            case MutationKind.ReplaceScalar:
                lines[i] = ReplaceToken(line, B, Scalars[C % Scalars.Length]);
                break;
            case MutationKind.UnknownKey:
                var indent = line.Length - line.TrimStart(' ').Length;
                var key = (B % 3) switch
                {
                    0 => "zz-unknown",
                    1 => s_keys[C % s_keys.Length],
                    _ => "x" + C,
                };
                lines.Insert(i, (C % 2 == 0 ? new string(' ', indent) : "") + key + ": " + Scalars[B % Scalars.Length]);
                break;
            case MutationKind.Truncate:
                var text = string.Join('\n', lines);
                var cut = text.Length == 0 ? 0 : (int)((long)B * 7919 % text.Length);
                lines.Clear();
                lines.AddRange(text[..cut].Split('\n'));
                break;
            case MutationKind.RandomBytes:
                var at = line.Length == 0 ? 0 : B % (line.Length + 1);
                var junk = new StringBuilder();
                for (var k = 0; k <= C % 4; k++)
                {
                    junk.Append(s_junk[(C / (k + 1) + (B * k)) % s_junk.Length]);
                }

                lines[i] = line[..at] + junk + line[at..];
                break;
            case MutationKind.Unclose:
                var closers = line.Select((ch, k) => (ch, k))
                    .Where(t => t.ch is '}' or ']' or '"' or '\'')
                    .Select(t => t.k)
                    .ToList();
                lines[i] =
                    closers.Count > 0 && B % 3 != 0
                        ? line.Remove(closers[C % closers.Count], 1)
                        : line
                            + (C % 4) switch
                            {
                                0 => " {",
                                1 => " [",
                                2 => " \"",
                                _ => " '",
                            };
                break;
            case MutationKind.SwapLines:
                var j = B % lines.Count;
                (lines[i], lines[j]) = (lines[j], lines[i]);
                break;
            case MutationKind.RenameKey:
                lines[i] = ReplaceKey(line, B, s_keys[C % s_keys.Length]);
                break;
            case MutationKind.RenameNode:
                lines[i] = ReplaceToken(line, B, s_nodes[C % s_nodes.Length]);
                break;
            case MutationKind.Garbage:
                // A whole line of junk: characters drawn from the junk set and printable ASCII by a simple LCG of B, C.
                var state = (uint)((B * 1_000_003) ^ C);
                var garbage = new StringBuilder();
                for (var k = 0; k < 1 + (C % 60); k++)
                {
                    state = (state * 1_664_525) + 1_013_904_223;
                    var r = (int)(state >> 8);
                    garbage.Append(r % 3 == 0 ? s_junk[r % s_junk.Length] : ((char)(32 + (r % 95))).ToString());
                }

                lines[i] = garbage.ToString();
                break;
        }
    }

    /// <inheritdoc />
    public override string ToString() => $"{Kind}({A},{B},{C})";

    private static string ReplaceToken(string line, int pick, string with)
    {
        var tokens = s_token.Matches(line);
        if (tokens.Count == 0)
        {
            return line + with;
        }

        var m = tokens[pick % tokens.Count];
        return line[..m.Index] + with + line[(m.Index + m.Length)..];
    }

    private static string ReplaceKey(string line, int pick, string with)
    {
        var keys = Regex.Matches(line, @"([A-Za-z][A-Za-z0-9\-]*)(?=:\s)");
        if (keys.Count == 0)
        {
            return line;
        }

        var m = keys[pick % keys.Count];
        return line[..m.Index] + with + line[(m.Index + m.Length)..];
    }
}
