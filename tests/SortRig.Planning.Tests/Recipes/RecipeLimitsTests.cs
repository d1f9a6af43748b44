using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Recipes;

/// <summary>Hostile recipe files are refused before parsing, with file:line:col, and the process survives.</summary>
public sealed class RecipeLimitsTests
{
    [Fact]
    public void Load_NestedDeeperThanTheLimit_RefusedAtTheNodeThatCrossesIt_NoStackOverflow()
    {
        // 100 000 nested flow lists: the document model would recurse once per level.
        var yaml = "recipe: " + new string('[', 100_000) + new string(']', 100_000) + "\n";
        var e = Assert.Throws<RecipeException>(() => RecipeLoader.Load(yaml, "deep.yaml"));
        Assert.Equal(1, e.Line);
        // the 32nd '[' is inside the root map: level 33
        Assert.Equal("recipe: ".Length + RecipeLimits.MaxDepth, e.Column);
        Assert.Contains("nested at most 32 deep", e.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("R1\u001b[2J", "positions[0].name", "U+001B at character 3")] // ECMA-48 erase display (from memory)
    [InlineData("R1\nR9", "positions[0].name", "U+000A at character 3")] // a newline forges a line in a log or CSV
    public void Load_ControlCharacterInAName_RefusedNamingTheFieldAndTheCharacter(
        string name,
        string field,
        string said
    )
    {
        var quoted = name.Replace("\u001b", "\\e", StringComparison.Ordinal)
            .Replace("\n", "\\n", StringComparison.Ordinal);
        var yaml =
            $"recipe: quad\nform: matched\nmatch-ppm: 1000\npositions:\n  - {{ name: \"{quoted}\", nominal: 10k }}\n "
            + $" - {{ name: b, nominal: 10k }}\n";

        var e = Assert.Throws<RecipeException>(() => RecipeLoader.Load(yaml, "hostile.yaml"));

        Assert.Equal(field, e.FieldPath);
        Assert.Contains(said, e.Message, StringComparison.Ordinal);
        Assert.StartsWith("hostile.yaml:5:", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Load_DescriptionOverSeveralLines_StillLoads()
    {
        var yaml =
            "recipe: quad\ndescription: |\n  first line\n  second\tline\nform: matched\nmatch-ppm: "
            + "1000\npositions:\n  - { name: a, nominal: 10k }\n  - { name: b, nominal: 10k }\n";

        var recipe = RecipeLoader.Load(yaml, "multi.yaml");

        Assert.Equal("first line\nsecond\tline\n", recipe.Description);
    }

    [Fact]
    public void Load_TextOverOneMebibyte_Refused()
    {
        var yaml = "recipe: big\ndescription: \"" + new string('x', RecipeLimits.MaxBytes) + "\"\n";
        var e = Assert.Throws<RecipeException>(() => RecipeLoader.Load(yaml, "big.yaml"));
        Assert.StartsWith("big.yaml:1:1:", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task LoadFile_DeviceThatNeverEnds_RefusedAsNotARegularFile_WithoutReadingIt()
    {
        var e = await Assert.ThrowsAsync<RecipeException>(() =>
            RecipeLoader.LoadFileAsync("/dev/zero", CancellationToken.None)
        );
        Assert.Equal("/dev/zero:1:1: (document): expected a regular file", e.Message);
    }

    [Fact]
    public async Task LoadFile_ShippedRecipe_WithByteOrderMark_StillLoads()
    {
        var path = Path.Combine(Path.GetTempPath(), $"bom-{Guid.NewGuid():N}.yaml");
        await File.WriteAllTextAsync(
            path,
            "recipe: quad\nform: matched\nmatch-ppm: 1000\npositions:\n  - { name: a, nominal: 10k }\n  - { name: b, "
                + "nominal: 10k }\n",
            new System.Text.UTF8Encoding(encoderShouldEmitUTF8Identifier: true)
        );
        try
        {
            var recipe = await RecipeLoader.LoadFileAsync(path, CancellationToken.None);
            Assert.Equal("quad", recipe.Name);
            Assert.Equal(2, recipe.Positions.Count);
        }
        finally
        {
            File.Delete(path);
        }
    }
}
