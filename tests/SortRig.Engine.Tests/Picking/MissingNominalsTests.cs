using SortRig.Engine.Picking;
using SortRig.Engine.Tests.Building;
using SortRig.Planning.Assembly;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Tests.Picking;

/// <summary>
/// A plan that makes no set because a position has no part of its nominal says which positions and what the parts on
/// hand are (common practice, no source: a builder short of a value is told which value, not only "no set").
/// </summary>
public sealed class MissingNominalsTests
{
    [Fact]
    public void LadderOfTenKOnly_NoSet_NamesNoPosition_WhenSeriesPairsFillThe20kPositions()
    {
        // The 20k positions take two 10k in series, so a reel of 10k has a candidate for every position.
        var parts = Enumerable.Range(1, 12).Select(i => BuildParts.Part(i, 10_000, i * 40)).ToList();

        Assert.Null(MissingNominals.Explain(BuildParts.Ladder8, parts, parts, new AssemblyOptions()));
    }

    [Fact]
    public void TwoNominalRecipe_OnlyOneNominalOnHand_NoSet_NamesTheEmptyPositionsAndThePartsHere()
    {
        // Two R and two 2R; only 10k parts, so the 2R (20k) positions have nothing.
        var parts = Enumerable.Range(1, 6).Select(i => BuildParts.Part(i, 10_000, i * 40)).ToList();
        var outcome = PickPlanner.Plan(
            BuildParts.LadderPair,
            parts,
            PickMode.Parts,
            qualify: false,
            new SetAssembler(new AssemblyOptions()),
            new AssemblyOptions()
        );

        Assert.Empty(outcome.List.Sets);
        var why = outcome.Note.Split('\n')[^1];
        Assert.StartsWith("no part to fill L1 (20 kOhm), L2 (20 kOhm); the parts here are 10 kOhm x6", why);
        Assert.DoesNotContain("not offered", why, StringComparison.Ordinal);
    }

    [Fact]
    public void WantedPartsTakenFromTheLibrary_AreCountedAsNotOffered()
    {
        var parts = Enumerable
            .Range(1, 4)
            .Select(i => BuildParts.Part(i, 20_000, i * 40) with { LibraryStatus = LibraryStatus.Taken })
            .Concat(Enumerable.Range(5, 2).Select(i => BuildParts.Part(i, 10_000, i * 40)))
            .ToList();
        var offered = parts.Where(p => p.LibraryStatus == LibraryStatus.Available).ToList();

        var why = MissingNominals.Explain(BuildParts.LadderPair, parts, offered, new AssemblyOptions());

        Assert.NotNull(why);
        Assert.Contains("10 kOhm x2, 20 kOhm x4", why, StringComparison.Ordinal);
        Assert.EndsWith("(4 of a nominal it takes are rejects, taken or suspect: not offered)", why);
    }
}
