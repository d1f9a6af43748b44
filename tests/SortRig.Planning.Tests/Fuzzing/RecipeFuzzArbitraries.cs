using FsCheck;
using FsCheck.Fluent;

namespace SortRig.Planning.Tests.Fuzzing;

/// <summary>One fuzz input: a shipped recipe and the mutations applied to it in order.</summary>
/// <param name="File">Index into <see cref="ShippedRecipes.Files"/>.</param>
/// <param name="Mutations">One to five mutations.</param>
public sealed record RecipeFuzzCase(int File, RecipeMutation[] Mutations)
{
    /// <summary>The mutated text.</summary>
    public string Text()
    {
        var lines = ShippedRecipes.Files[File].Text.Split('\n').ToList();
        foreach (var m in Mutations)
        {
            m.Apply(lines);
        }

        return string.Join('\n', lines);
    }

    /// <inheritdoc />
    public override string ToString() =>
        $"{ShippedRecipes.Files[File].Name} <- {string.Join(", ", Mutations.AsEnumerable())}";
}

/// <summary>The shipped recipes/*.yaml, read once.</summary>
internal static class ShippedRecipes
{
    public static IReadOnlyList<(string Name, string Text)> Files { get; } =
        Directory
            .GetFiles(Path.Combine(RepoPaths.Root, "recipes"), "*.yaml")
            .Order(StringComparer.Ordinal)
            .Select(f => (Path.GetFileName(f), File.ReadAllText(f).Replace("\r\n", "\n", StringComparison.Ordinal)))
            .ToList();
}

/// <summary>FsCheck generators of mutated recipes. Value-level mutations are weighted up so that many inputs get past
/// the YAML parser and exercise the field checks.</summary>
public static class RecipeFuzzArbitraries
{
    private static Gen<RecipeMutation> Mutation =>
        from kind in Gen.Frequency(
            (3, Gen.Constant(MutationKind.DeleteLine)),
            (2, Gen.Constant(MutationKind.DuplicateLine)),
            (2, Gen.Constant(MutationKind.Reindent)),
            (8, Gen.Constant(MutationKind.ReplaceScalar)),
            (2, Gen.Constant(MutationKind.UnknownKey)),
            (1, Gen.Constant(MutationKind.Truncate)),
            (2, Gen.Constant(MutationKind.RandomBytes)),
            (2, Gen.Constant(MutationKind.Unclose)),
            (1, Gen.Constant(MutationKind.SwapLines)),
            (3, Gen.Constant(MutationKind.RenameKey)),
            (3, Gen.Constant(MutationKind.RenameNode)),
            (1, Gen.Constant(MutationKind.Garbage))
        )
        from a in Gen.Choose(0, 1000)
        from b in Gen.Choose(0, 1000)
        from c in Gen.Choose(0, 1000)
        select new RecipeMutation(kind, a, b, c);

    public static Arbitrary<RecipeFuzzCase> Cases() =>
        Arb.From(
            from file in Gen.Choose(0, ShippedRecipes.Files.Count - 1)
            from count in Gen.Frequency((6, Gen.Constant(1)), (3, Gen.Constant(2)), (2, Gen.Choose(3, 5)))
            from mutations in Gen.ArrayOf(Mutation, count)
            select new RecipeFuzzCase(file, mutations)
        );
}
