using FsCheck;
using FsCheck.Fluent;

namespace SortRig.Instruments.Tests.Fuzzing;

/// <summary>Damaged resource strings: character edits, and edits of whole "::" parts or '?' options.</summary>
internal static class ResourceStringMutations
{
    /// <summary>Arbitrary text, valid strings with character edits, and valid strings with part edits.</summary>
    public static Gen<Mutated> Any =>
        Gen.Frequency(
            (
                2,
                TextMutations
                    .Arbitrary(ResourceStringGenerators.Syntax)
                    .Select(t => new Mutated(string.Empty, t, "arbitrary"))
            ),
            (
                3,
                TextMutations.Mutate(
                    ResourceStringGenerators.Valid.Select(v => v.Text),
                    ResourceStringGenerators.Syntax
                )
            ),
            (3, PartEdited)
        );

    private static Gen<Mutated> PartEdited =>
        from valid in ResourceStringGenerators.Valid
        from edit in Gen.Elements("delete", "duplicate", "swap", "replace", "empty", "append", "option", "class")
        from at in Gen.Choose(0, 9)
        from chunk in TextMutations.Chunk(ResourceStringGenerators.Syntax)
        select new Mutated(
            valid.Text,
            EditPart(valid.Text, edit, at, chunk),
            $"{edit} part {at} with '{TextEdit.Escaped(chunk)}'"
        );

    private static string EditPart(string text, string edit, int at, string chunk)
    {
        var query = text.IndexOf('?', StringComparison.Ordinal);
        var options = query < 0 ? string.Empty : text[query..];
        var parts = (query < 0 ? text : text[..query]).Split("::").ToList();
        var i = at % parts.Count;
        switch (edit)
        {
            case "delete" when parts.Count > 1:
                parts.RemoveAt(i);
                break;
            case "duplicate":
                parts.Insert(i, parts[i]);
                break;
            case "swap" when parts.Count > 1:
                var j = (i + 1) % parts.Count;
                (parts[i], parts[j]) = (parts[j], parts[i]);
                break;
            case "empty":
                parts[i] = string.Empty;
                break;
            case "append":
                parts.Add(chunk);
                break;
            case "option":
                options = (options.Length == 0 ? "?" : options + "&") + chunk;
                break;
            case "class":
                parts[^1] = chunk.Length % 2 == 0 ? "SOCKET" : "INSTR";
                break;
            default:
                parts[i] = chunk;
                break;
        }

        return string.Join("::", parts) + options;
    }
}
