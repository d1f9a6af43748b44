using FsCheck;
using FsCheck.Fluent;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>One character-level edit of a text; positions are reduced modulo the text length when applied.</summary>
/// <param name="Kind">Insert, Delete, Replace or Truncate.</param>
/// <param name="Where">Any non-negative number, taken modulo the text length.</param>
/// <param name="Payload">The inserted or replacing text.</param>
internal sealed record TextEdit(TextEditKind Kind, int Where, string Payload)
{
    public string ApplyTo(string text)
    {
        var at = text.Length == 0 ? 0 : Where % (text.Length + 1);
        var end = Math.Min(text.Length, at + 1);
        return Kind switch
        {
            TextEditKind.Insert => text.Insert(at, Payload),
            TextEditKind.Delete => text.Remove(at, end - at),
            TextEditKind.Replace => string.Concat(text.AsSpan(0, at), Payload, text.AsSpan(end)),
            _ => text[..at],
        };
    }

    /// <inheritdoc/>
    public override string ToString() =>
        Kind is TextEditKind.Insert or TextEditKind.Replace
            ? $"{Kind}@{Where}:'{Escaped(Payload)}'"
            : $"{Kind}@{Where}";

    /// <summary>The text with control and non-ASCII characters as \uXXXX, for readable failure reports.</summary>
    public static string Escaped(string text) =>
        string.Concat(text.Select(c => c is >= ' ' and <= '~' ? c.ToString() : $"\\u{(int)c:X4}"));
}

internal enum TextEditKind
{
    Insert,
    Delete,
    Replace,
    Truncate,
}

/// <summary>Generators of hostile text: odd characters, and strings that are valid ones slightly damaged.</summary>
internal static class TextMutations
{
    /// <summary>
    /// Characters that trouble parsers: NUL and other controls, white space of several kinds
    /// (no-break space, em space, line and paragraph separators, NEL), non-ASCII digits (Arabic-Indic,
    /// fullwidth), a lone surrogate, a byte-order mark and the replacement character.
    /// </summary>
    public static readonly char[] Awkward =
    [
        '\0',
        '\u0001',
        '\a',
        '\b',
        '\t',
        '\n',
        '\v',
        '\f',
        '\r',
        '\u001B',
        '\u007F',
        '\u0085',
        '\u00A0',
        '\u2003',
        '\u2028',
        '\u2029',
        '\u0663',
        '\uFF15',
        '\uD835',
        '\uDFD9',
        '\uFEFF',
        '\uFFFD',
        '\u00E9',
        '\u212A',
    ];

    /// <summary>Any char, weighted towards <paramref name="syntax"/> (the input's own punctuation) and <see
    /// cref="Awkward"/>.</summary>
    public static Gen<char> Char(string syntax) =>
        Gen.Frequency(
            (4, Gen.Elements(syntax.ToCharArray())),
            (2, Gen.Elements(Awkward)),
            (2, Gen.Elements("0123456789abcxyzEe+-. ".ToCharArray())),
            (1, Gen.Choose(0, 0xFFFF).Select(i => (char)i))
        );

    /// <summary>Short runs of <see cref="Char"/>, sometimes empty, sometimes long (up to 300 characters).</summary>
    public static Gen<string> Chunk(string syntax) =>
        Gen.Frequency(
            (6, Gen.Choose(1, 3).SelectMany(n => Gen.ArrayOf(Char(syntax), n)).Select(a => new string(a))),
            (1, Gen.Constant(string.Empty)),
            (1, Gen.Choose(20, 300).SelectMany(n => Gen.ArrayOf(Char(syntax), n)).Select(a => new string(a)))
        );

    /// <summary>Arbitrary strings of 0-80 characters drawn from <see cref="Char"/>, plus FsCheck's own
    /// strings.</summary>
    public static Gen<string> Arbitrary(string syntax) =>
        Gen.Frequency(
            (3, Gen.Choose(0, 80).SelectMany(n => Gen.ArrayOf(Char(syntax), n)).Select(a => new string(a))),
            (1, ArbMap.Default.GeneratorFor<string>().Select(s => s ?? string.Empty))
        );

    /// <summary>One edit; inserts and replacements take their payload from <see cref="Chunk"/>.</summary>
    public static Gen<TextEdit> Edit(string syntax) =>
        from kind in Gen.Frequency(
            (4, Gen.Constant(TextEditKind.Insert)),
            (3, Gen.Constant(TextEditKind.Delete)),
            (3, Gen.Constant(TextEditKind.Replace)),
            (1, Gen.Constant(TextEditKind.Truncate))
        )
        from at in Gen.Choose(0, int.MaxValue)
        from payload in Chunk(syntax)
        select new TextEdit(kind, at, payload);

    /// <summary>1-3 edits applied in turn to a text from <paramref name="valid"/>.</summary>
    public static Gen<Mutated> Mutate(Gen<string> valid, string syntax) =>
        from original in valid
        from edits in Gen.Choose(1, 3).SelectMany(n => Gen.ArrayOf(Edit(syntax), n))
        select new Mutated(
            original,
            edits.Aggregate(original, (text, e) => e.ApplyTo(text)),
            string.Join(" ", edits.Select(e => e.ToString()))
        );
}

/// <summary>A valid text, its damaged form, and the edits that damaged it (shown when a property fails).</summary>
internal sealed record Mutated(string Original, string Text, string Edits)
{
    /// <inheritdoc/>
    public override string ToString() => $"'{TextEdit.Escaped(Original)}' -> '{TextEdit.Escaped(Text)}' by {Edits}";
}
