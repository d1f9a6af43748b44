using System.Text.RegularExpressions;
using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Scpi;

/// <summary>
/// Splits a program message into units at ';' and each unit into header and parameters at ','
/// (IEEE 488.2 sec. 7; separators inside quotes or a channel list's parentheses do not count).
/// </summary>
internal static partial class MessageParser
{
    public static IReadOnlyList<string> SplitUnits(string message) => Split(message, ';');

    public static ProgramUnit ParseUnit(string unit)
    {
        var text = unit.Trim();
        var space = text.IndexOfAny([' ', '\t']);
        var header = space < 0 ? text : text[..space];
        var rest = space < 0 ? string.Empty : text[(space + 1)..].Trim();
        if (!HeaderSyntax().IsMatch(header))
        {
            throw new ScpiException(ScpiError.Syntax);
        }

        var isQuery = header.EndsWith('?');
        var bare = isQuery ? header[..^1] : header;
        var rooted = bare.StartsWith(':');
        var nodes = (rooted ? bare[1..] : bare).Split(':');
        var parameters = rest.Length == 0 ? [] : Split(rest, ',').Select(p => p.Trim()).ToArray();
        if (parameters.Any(p => p.Length == 0))
        {
            throw new ScpiException(ScpiError.Syntax);
        }

        return new ProgramUnit(rooted, nodes, isQuery, parameters);
    }

    private static string[] Split(string text, char separator)
    {
        var parts = new List<string>();
        var start = 0;
        var depth = 0;
        char? quote = null;
        for (var i = 0; i < text.Length; i++)
        {
            var c = text[i];
            if (quote is char q)
            {
                quote = c == q ? null : quote;
            }
            else if (c is '"' or '\'')
            {
                quote = c;
            }
            else if (c == '(')
            {
                depth++;
            }
            else if (c == ')' && --depth < 0)
            {
                throw new ScpiException(ScpiError.Syntax);
            }
            else if (c == separator && depth == 0)
            {
                parts.Add(text[start..i]);
                start = i + 1;
            }
        }

        if (quote is not null || depth != 0)
        {
            throw new ScpiException(ScpiError.Syntax);
        }

        parts.Add(text[start..]);
        return [.. parts];
    }

    [GeneratedRegex(@"^(\*[A-Za-z]+\??|:?[A-Za-z][A-Za-z0-9_]*(:[A-Za-z][A-Za-z0-9_]*)*\??)$")]
    private static partial Regex HeaderSyntax();
}
