using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Fuzzing;

/// <summary>
/// Inputs the recipe fuzzer found that crashed the loader, loaded a recipe that could not be evaluated, or gave an
/// error naming no field. Each is reduced by hand to a few lines.
/// </summary>
public sealed class RecipeFuzzRegressionTests
{
    private const string Quad =
        "recipe: q\nform: matched\nmatch-ppm: 1000\nbase: 10k\npositions:\n  - { name: R1, ratio: 1 }\n  - { name: "
        + "R2, ratio: 1 }\n";

    private const string DiffAmp =
        "recipe: d\nform: network\nground: gnd\nsources:\n  - { name: VP, plus: inp, minus: gnd, volts: 0.5 }\n"
        + "  - { name: VN, plus: inn, minus: gnd, volts: -0.5 }\namplifiers:\n  - { name: U1, plus: np, minus: nm, "
        + "output: out }\n"
        + "positions:\n  - { name: R1, nominal: 10k, between: [inn, nm] }\n  - { name: R2, nominal: 10k, between: "
        + "[nm, out] }\n"
        + "  - { name: R3, nominal: 10k, between: [inp, np] }\n  - { name: R4, nominal: 10k, between: [np, gnd] }\n"
        + "outputs:\n  - { name: gain, kind: gain, output: out, input: inp - inn, target: 1, tolerance-ppm: 500 }\n";

    private static RecipeException Refused(string yaml) =>
        Assert.Throws<RecipeException>(() => RecipeLoader.Load(yaml, "r.yaml"));

    [Fact]
    public void ByteOrderMarkInsideAFlowMapping_IsAYamlProblemWithALine()
    {
        // Was: InvalidOperationException from YamlDotNet's scanner.
        var e = Refused(Quad.Replace("R2, ratio: 1 }", "R2, ratio: 1.0\n\uFEFF[2000 }", StringComparison.Ordinal));
        Assert.Equal("(document)", e.FieldPath);
        Assert.InRange(e.Line, 7, 9);
    }

    [Fact]
    public void TabWhereAKeyShouldStart_IsAYamlProblem()
    {
        // Was: ArgumentException "The current event is of an unsupported type" from YamlDotNet.
        var e = Refused("# c\n\t: q\nform: matched\n");
        Assert.Equal("(document)", e.FieldPath);
        Assert.InRange(e.Line, 1, 4);
    }

    [Fact]
    public void BlankBase_NamesTheField()
    {
        // Was: IndexOutOfRangeException (a quoted blank trimmed to nothing).
        var e = Refused(Quad.Replace("base: 10k", "base: ' '", StringComparison.Ordinal));
        Assert.Equal("base", e.FieldPath);
        Assert.Equal(4, e.Line);
    }

    [Theory]
    [InlineData("1e308M")] // overflowed to infinity after the suffix and loaded
    [InlineData("1e-320")] // a denormal loaded; sensitivities ~ 1/R² were infinite, worst cases NaN
    [InlineData("2e15")]
    public void NominalOutsideTheSolverRange_IsRefused(string nominal)
    {
        var e = Refused(DiffAmp.Replace("R4, nominal: 10k", $"R4, nominal: {nominal}", StringComparison.Ordinal));
        Assert.Equal("positions[3].nominal", e.FieldPath);
        Assert.Contains("1e-6 to 1e15", e.Expected, StringComparison.Ordinal);
    }

    [Fact]
    public void RatioTimesBaseOutsideTheRange_IsRefused()
    {
        var e = Refused(
            Quad.Replace("base: 10k", "base: 1e12", StringComparison.Ordinal)
                .Replace("R2, ratio: 1", "R2, ratio: 1e4", StringComparison.Ordinal)
        );
        Assert.Equal("positions[1].ratio", e.FieldPath);
    }

    [Fact]
    public void GainWhoseInputIsZeroVoltsAtNominal_IsRefusedEvenWithAnExplicitTarget()
    {
        // Was: loaded with an infinite gain at nominal, every set's score NaN. VN drives a node nothing else touches
        // and R4 ends on a node nothing else touches, so no current flows: inn = nm = np = inp and the input inp - inn
        // is 0 V.
        var e = Refused(
            DiffAmp
                .Replace("plus: inn, minus: gnd", "plus: elsewhere, minus: gnd", StringComparison.Ordinal)
                .Replace("between: [np, gnd]", "between: [np, dangling]", StringComparison.Ordinal)
        );
        Assert.Equal("outputs[0]", e.FieldPath);
    }

    [Theory]
    [InlineData("just text\n", 1)]
    [InlineData("- a\n- b\n", 1)]
    public void RootThatIsNotAMapping_NamesTheTopLevel(string yaml, int line)
    {
        // Was: an empty field path ("r.yaml:1:1: : expected a mapping of fields").
        var e = Refused(yaml);
        Assert.Equal("(top level)", e.FieldPath);
        Assert.Equal(line, e.Line);
    }

    [Theory]
    [InlineData("' ': 1\n")]
    [InlineData("[a, b]: 1\n")]
    public void BlankOrNonTextKey_GetsAPath(string extra)
    {
        var e = Refused(Quad + extra);
        Assert.Equal("(blank or non-text key)", e.FieldPath);
        Assert.Equal(8, e.Line);
    }
}
