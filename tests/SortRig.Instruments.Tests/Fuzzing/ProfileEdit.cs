using System.Text.RegularExpressions;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>What a <see cref="ProfileEdit"/> does to a profile text.</summary>
internal enum ProfileEditKind
{
    DeleteLine,
    DuplicateLine,
    SwapLines,
    Indent,
    Dedent,
    ReplaceScalar,
    InsertKey,
    InsertNoise,
    Truncate,
}

/// <summary>
/// One edit of a YAML profile. <see cref="Where"/> picks the line, scalar or character (modulo
/// their count); <see cref="Payload"/> is the indentation, replacement scalar, "key: value" line or noise.
/// </summary>
internal sealed partial record ProfileEdit(ProfileEditKind Kind, int Where, string Payload)
{
    public string ApplyTo(string text)
    {
        var lines = text.Split('\n').ToList();
        var i = Where % lines.Count;
        switch (Kind)
        {
            case ProfileEditKind.DeleteLine:
                lines.RemoveAt(i);
                break;
            case ProfileEditKind.DuplicateLine:
                lines.Insert(i, lines[i]);
                break;
            case ProfileEditKind.SwapLines:
                var j = (i + 1) % lines.Count;
                (lines[i], lines[j]) = (lines[j], lines[i]);
                break;
            case ProfileEditKind.Indent:
                lines[i] = Payload + lines[i];
                break;
            case ProfileEditKind.Dedent:
                lines[i] = lines[i].StartsWith("  ", StringComparison.Ordinal) ? lines[i][2..] : lines[i].TrimStart();
                break;
            case ProfileEditKind.InsertKey:
                var indent = lines[i][..(lines[i].Length - lines[i].TrimStart().Length)];
                lines.Insert(
                    i,
                    (lines[i].TrimStart().StartsWith("- ", StringComparison.Ordinal) ? indent + "  " : indent) + Payload
                );
                break;
            case ProfileEditKind.ReplaceScalar:
                var scalars = Scalar().Matches(text);
                return scalars.Count == 0 ? text : ReplaceAt(text, scalars[Where % scalars.Count]);
            case ProfileEditKind.InsertNoise:
                return text.Insert(Where % (text.Length + 1), Payload);
            default:
                return text[..(Where % (text.Length + 1))];
        }

        return string.Join('\n', lines);
    }

    /// <inheritdoc/>
    public override string ToString() =>
        Kind switch
        {
            ProfileEditKind.DeleteLine
            or ProfileEditKind.DuplicateLine
            or ProfileEditKind.SwapLines
            or ProfileEditKind.Dedent
            or ProfileEditKind.Truncate => $"{Kind}@{Where}",
            _ => $"{Kind}@{Where}:'{TextEdit.Escaped(Payload)}'",
        };

    private string ReplaceAt(string text, Match m) =>
        string.Concat(text.AsSpan(0, m.Index), Payload, text.AsSpan(m.Index + m.Length));

    // A value after "key: ", "- " or inside a [flow, list]: a quoted string, or plain text up to a comma, bracket or
    // comment.
    [GeneratedRegex(
        @"(?<=(?::|-|[\[,])[ \t]+|\[)"
            + @"(?:""[^""\n]*""|'[^'\n]*'|[^\s{}\[\],#:""'][^{}\[\],#\n:]*?)"
            + @"(?=[ \t]*(?:[,\]}#\n]|\z))",
        RegexOptions.CultureInvariant
    )]
    private static partial Regex Scalar();
}
