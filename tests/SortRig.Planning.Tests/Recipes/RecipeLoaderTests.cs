using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Recipes;

public sealed class RecipeLoaderTests
{
    [Fact]
    public async Task ShippedRecipes_AllLoad()
    {
        var files = Directory.GetFiles(Path.Combine(RepoPaths.Root, "recipes"), "*.yaml");
        Assert.True(files.Length >= 6);
        foreach (var f in files)
        {
            var recipe = await RecipeLoader.LoadFileAsync(f, CancellationToken.None);
            Assert.NotEmpty(recipe.Positions);
        }
    }

    [Fact]
    public async Task RatioSet_HasNominalsFromBaseAndRatio_AndPairBuilds()
    {
        var r = await RecipeLoader.LoadFileAsync(RepoPaths.Recipe("ratio-set.yaml"), CancellationToken.None);
        Assert.Equal(RecipeForm.Matched, r.Form);
        // base 1k × ratios 1, 2, 2, 4 (arithmetic of the shipped file).
        Assert.Equal([1e3, 2e3, 2e3, 4e3], r.Positions.Select(p => p.Nominal));
        Assert.Equal(PairBuilds.Parallel, r.Positions[0].Pairs);
        Assert.Equal(PairBuilds.None, r.Positions[1].Pairs);
        Assert.Equal(PairBuilds.Series, r.Positions[3].Pairs);
        Assert.Equal(500, r.MatchTolerancePpm);
    }

    [Fact]
    public async Task R2RRecipe_AtNominal_MeetsEveryBitWeight()
    {
        // Bit i of an n-bit R-2R ladder weighs Vref 2^i / 2^n (textbook; from memory): the shipped targets must agree.
        var r = await RecipeLoader.LoadFileAsync(RepoPaths.Recipe("r2r-dac-8bit.yaml"), CancellationToken.None);
        var checks = NetworkEvaluator.Evaluate(r, r.Positions.ToDictionary(p => p.Name, p => p.Nominal));
        Assert.Equal(8, checks.Count);
        Assert.All(checks, c => Assert.True(Math.Abs(c.Error) < 1e-12, c.Name));
        Assert.Equal(1.28, checks.Single(c => c.Name == "bit7").Value, 12);
    }

    [Fact]
    public async Task DiffAmpRecipe_GainAndCommonModeFollowTheTextbookFormula()
    {
        // Vout = V+ (R4/(R3+R4))(1 + R2/R1) − V− R2/R1 for the four-resistor difference amplifier (textbook; from
        // memory).
        var r = await RecipeLoader.LoadFileAsync(RepoPaths.Recipe("diff-amp-g10.yaml"), CancellationToken.None);
        var v = new Dictionary<string, double>
        {
            ["R1"] = 1_002,
            ["R2"] = 10_000,
            ["R3"] = 1_000,
            ["R4"] = 10_000,
        };
        double Out(double vp, double vn) =>
            (vp * v["R4"] / (v["R3"] + v["R4"]) * (1 + (v["R2"] / v["R1"]))) - (vn * v["R2"] / v["R1"]);
        var checks = NetworkEvaluator.Evaluate(r, v);
        Assert.Equal(Out(0.5, -0.5), checks[0].Value, 12);
        Assert.Equal(Out(1, 1), checks[1].Value, 12);
        Assert.False(
            checks[1].Meets,
            "0.2 % high R1 gives (R1R4 - R2R3)/(R1(R3+R4)) = 1.8 mV per volt of common mode, over the 1 mV spec"
        );
    }

    // Line and column numbers are counted by hand in the YAML text (1-based).
    [Theory]
    [InlineData(
        "recipe: q\nform: matched\nmatch-ppm: 1000\npositions:\n  - { name: R1, nominal: 10k }\n  - { name: R2, "
            + "nominal: 10q }\n",
        6,
        26,
        "positions[1].nominal",
        "resistance"
    )]
    [InlineData(
        "recipe: q\nform: matched\npositions:\n  - { name: R1, nominal: 10k }\n",
        1,
        1,
        "match-ppm",
        "field is missing"
    )]
    [InlineData(
        "recipe: q\nform: matched\nmatch-ppm: -5\npositions:\n  - { name: R1, nominal: 10k }\n",
        3,
        12,
        "match-ppm",
        "0.001 to 100000"
    )]
    [InlineData("recipe: q\nform: sorted\n", 2, 7, "form", "'matched' or 'network'")]
    [InlineData(
        "recipe: q\nform: matched\nmatch-ppm: 100\npositions:\n  - { name: R1, nominal: 10k }\n  - { name: R1, "
            + "nominal: 10k }\n",
        6,
        13,
        "positions[1].name",
        "repeated"
    )]
    [InlineData(
        "recipe: q\nform: matched\nmatch-ppm: 100\ncolour: red\npositions: []\n",
        4,
        1,
        "colour",
        "one of the fields"
    )]
    [InlineData(
        "recipe: q\nform: matched\nmatch-ppm: 100\npositions:\n  - { name: R1, ratio: 2 }\n",
        5,
        24,
        "positions[0].ratio",
        "'base'"
    )]
    [InlineData(
        "recipe: q\nform: matched\nmatch-ppm: 100\npositions:\n  - { name: R1, nominal: 1k, pairs: [triple] }\n",
        5,
        38,
        "positions[0].pairs[0]",
        "'series' or 'parallel'"
    )]
    [InlineData("recipe: q\nform: [unclosed\n", 3, 1, "(document)", "well-formed YAML")]
    public void MatchedForm_BadInput_NamesLineColumnAndField(
        string yaml,
        int line,
        int column,
        string field,
        string expectedFragment
    )
    {
        var e = Assert.Throws<RecipeException>(() => RecipeLoader.Load(yaml, "bad.yaml"));
        Assert.Equal(("bad.yaml", line, column, field), (e.FileName, e.Line, e.Column, e.FieldPath));
        Assert.Contains(expectedFragment, e.Expected, StringComparison.Ordinal);
        Assert.StartsWith($"bad.yaml:{line}:{column}: {field}: expected", e.Message, StringComparison.Ordinal);
    }

    private const string NetworkHead =
        "recipe: d\nform: network\nground: gnd\nsources:\n  - { name: V1, plus: in, minus: gnd, volts: 10 "
        + "}\npositions:\n  - { name: R1, nominal: 10k, between: [in, out] }\n";

    [Theory]
    [InlineData(
        "  - { name: R2, nominal: 10k, between: [out, gnd] }\noutputs:\n  - { name: o, kind: voltage-ratio, "
            + "numerator: outt, denominator: in, tolerance-ppm: 10 }\n",
        10,
        48,
        "outputs[0].numerator",
        "a node of the netlist"
    )]
    [InlineData(
        "  - { name: R2, nominal: 10k, between: [out, gnd] }\noutputs:\n  - { name: o, kind: current, node: out }\n",
        10,
        22,
        "outputs[0].kind",
        "node-voltage"
    )]
    [InlineData(
        "  - { name: R2, nominal: 10k, between: [x, y] }\noutputs:\n  - { name: o, kind: node-voltage, node: out, "
            + "tolerance-mv: 1 }\n",
        7,
        3,
        "positions",
        "solves with nominal parts"
    )]
    [InlineData(
        "  - { name: R2, nominal: 10k, between: [out, gnd] }\noutputs:\n  - { name: o, kind: node-voltage, node: "
            + "out, tolerance-mv: 1, drive: { V9: 1 } }\n",
        10,
        73,
        "outputs[0].drive.V9",
        "one of the fields V1"
    )]
    [InlineData(
        "  - { name: R2, nominal: 10k, between: [out, gnd] }\noutputs:\n  - { name: o, kind: position-ratio, "
            + "numerator: R1, denominator: R7, tolerance-ppm: 5 }\n",
        10,
        66,
        "outputs[0].denominator",
        "a position"
    )]
    [InlineData(
        "  - { name: R2, nominal: 10k, between: [out, gnd] }\noutputs:\n  - { name: o, kind: voltage-ratio, "
            + "numerator: out, denominator: gnd, tolerance-ppm: 5 }\n",
        10,
        5,
        "outputs[0]",
        "not zero"
    )]
    public void NetworkForm_BadInput_NamesLineColumnAndField(
        string tail,
        int line,
        int column,
        string field,
        string expectedFragment
    )
    {
        var e = Assert.Throws<RecipeException>(() => RecipeLoader.Load(NetworkHead + tail, "net.yaml"));
        Assert.Equal((line, column, field), (e.Line, e.Column, e.FieldPath));
        Assert.Contains(expectedFragment, e.Expected, StringComparison.Ordinal);
    }
}
