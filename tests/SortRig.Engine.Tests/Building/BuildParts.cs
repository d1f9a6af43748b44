using SortRig.Measurement.Uncertainty;
using SortRig.Planning.Recipes;
using SortRig.Storage.Contracts;

namespace SortRig.Engine.Tests.Building;

/// <summary>Small data factory for the build tests: logged parts in tray slots, and invented test recipes.</summary>
internal static class BuildParts
{
    /// <summary>Four equal positions matched to 1000 ppm (invented test recipe).</summary>
    public static Recipe Quad =>
        RecipeLoader.Load(
            """
            recipe: quad-test
            form: matched
            match-ppm: 1000
            base: 10k
            positions:
              - { name: R1, ratio: 1 }
              - { name: R2, ratio: 1 }
              - { name: R3, ratio: 1 }
              - { name: R4, ratio: 1 }
            """,
            "quad-test.yaml"
        );

    /// <summary>The text of <see cref="LadderPair"/>, for tests that hand the sort verb a recipe file.</summary>
    public const string LadderPairYaml = """
        recipe: ladder-pair
        form: matched
        match-ppm: 2000
        base: 10k
        positions:
          - { name: S1, ratio: 1 }
          - { name: S2, ratio: 1 }
          - { name: L1, ratio: 2 }
          - { name: L2, ratio: 2 }
        """;

    /// <summary>A two-nominal ladder section matched to 2000 ppm: two R and two 2R (invented test recipe).</summary>
    public static Recipe LadderPair => RecipeLoader.Load(LadderPairYaml, "ladder-pair.yaml");

    /// <summary>Five 10k and seven 20k positions, every 20k one may be two 10k in series (the shape of an 8-bit R-2R
    /// ladder; invented test recipe).</summary>
    public static Recipe Ladder8 =>
        RecipeLoader.Load(
            """
            recipe: ladder-8
            form: matched
            match-ppm: 1000
            base: 10k
            positions:
              - { name: RT, ratio: 2, pairs: [series] }
              - { name: L0, ratio: 2, pairs: [series] }
              - { name: L1, ratio: 2, pairs: [series] }
              - { name: L2, ratio: 2, pairs: [series] }
              - { name: L3, ratio: 2, pairs: [series] }
              - { name: L4, ratio: 2, pairs: [series] }
              - { name: L5, ratio: 2, pairs: [series] }
              - { name: S1, ratio: 1 }
              - { name: S2, ratio: 1 }
              - { name: S3, ratio: 1 }
              - { name: S4, ratio: 1 }
              - { name: S5, ratio: 1 }
            """,
            "ladder-8.yaml"
        );

    /// <summary>A live part in its own tray slot, value from a deviation in ppm, expanded transfer uncertainty in
    /// ppm.</summary>
    public static PartRecord Part(long id, double nominal, double ppm, double expandedPpm = 20)
    {
        var value = nominal * (1 + (ppm * 1e-6));
        var u = value * expandedPpm * 1e-6 / 2;
        return new PartRecord(
            id,
            Guid.NewGuid(),
            1,
            1,
            (int)id,
            nominal,
            new MeasuredValue(value, u, u),
            1e5,
            1,
            null,
            default,
            null,
            $"T1-A{id:00}",
            PartState.Announced,
            true,
            null,
            LibraryStatus.Available,
            null
        );
    }
}
