namespace SortRig.Instruments.Resources;

public static partial class ResourceStringParser
{
    /// <summary>True when <paramref name="text"/> is a TYPED resource (keyword only; the rest is checked by <see
    /// cref="Parse"/>).</summary>
    public static bool IsTyped(string? text) =>
        text is not null && text.TrimStart().StartsWith("TYPED::", StringComparison.OrdinalIgnoreCase);

    private static string TypedProfileName(ResourceParts parts, int index, int body)
    {
        if (body > index)
        {
            throw parts.Error(index + 1, "is unexpected after the profile name", "'INSTR'");
        }

        return NamePattern().IsMatch(parts.At(index).Value)
            ? parts.At(index).Value
            : throw parts.IsNot(index, "a typed-meter profile name of letters, digits, '-', '_' or '.'");
    }
}
