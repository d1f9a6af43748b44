namespace SortRig.Instruments.Resources;

/// <summary>
/// A resource string cut into its "::"-separated parts (brackets, as around an IPv6 address,
/// protect a "::") plus the optional "?key=value&amp;..." serial options, each with its offset.
/// </summary>
internal sealed class ResourceParts
{
    private ResourceParts(string text, List<(string Value, int Offset)> parts, string? options, int optionsOffset)
    {
        Text = text;
        Parts = parts;
        Options = options;
        OptionsOffset = optionsOffset;
    }

    public string Text { get; }

    public IReadOnlyList<(string Value, int Offset)> Parts { get; }

    /// <summary>The text after '?', or null when there is none.</summary>
    public string? Options { get; }

    public int OptionsOffset { get; }

    public static ResourceParts Split(string text)
    {
        var query = text.IndexOf('?', StringComparison.Ordinal);
        var body = query < 0 ? text : text[..query];
        var parts = new List<(string, int)>();
        var start = 0;
        var depth = 0;
        for (var i = 0; i < body.Length; i++)
        {
            if (body[i] == '[')
            {
                depth++;
            }
            else if (body[i] == ']')
            {
                depth = Math.Max(0, depth - 1);
            }
            else if (depth == 0 && body[i] == ':' && i + 1 < body.Length && body[i + 1] == ':')
            {
                parts.Add((body[start..i], start));
                start = i + 2;
                i++;
            }
        }

        parts.Add((body[start..], start));
        return new ResourceParts(text, parts, query < 0 ? null : text[(query + 1)..], query + 1);
    }

    /// <summary>Part by 0-based index, or an empty part where the address ends (before any '?') when it is
    /// missing.</summary>
    public (string Value, int Offset) At(int index) =>
        index < Parts.Count ? Parts[index] : (string.Empty, Options is null ? Text.Length : OptionsOffset - 1);

    /// <summary>An error about the part at 0-based <paramref name="index"/>.</summary>
    public ResourceStringException Error(int index, string problem, string expected)
    {
        var (value, offset) = At(index);
        return new ResourceStringException(Text, index + 1, value, offset, problem, expected);
    }

    /// <summary>An error saying the part at <paramref name="index"/> is not what was expected.</summary>
    public ResourceStringException IsNot(int index, string expected) =>
        Error(index, At(index).Value.Length == 0 ? $"is missing: expected {expected}" : $"is not {expected}", expected);
}
