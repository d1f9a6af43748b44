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
        Assert.Equal("recipe: ".Length + RecipeLimits.MaxDepth, e.Column); // the 32nd '[' is inside the root map: level 33
        Assert.Contains("nested at most 32 deep", e.Message, StringComparison.Ordinal);
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
        var e = await Assert.ThrowsAsync<RecipeException>(() => RecipeLoader.LoadFileAsync("/dev/zero", CancellationToken.None));
        Assert.Equal("/dev/zero:1:1: (document): expected a regular file", e.Message);
    }

    [Fact]
    public async Task LoadFile_ShippedRecipe_WithByteOrderMark_StillLoads()
    {
        var path = Path.Combine(Path.GetTempPath(), $"bom-{Guid.NewGuid():N}.yaml");
        await File.WriteAllTextAsync(path, "recipe: quad\nform: matched\nmatch-ppm: 1000\npositions:\n  - { name: a, nominal: 10k }\n  - { name: b, nominal: 10k }\n",
            new System.Text.UTF8Encoding(encoderShouldEmitUTF8Identifier: true));
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
