using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Networks;

public sealed class NetworkSolverTests
{
    private static readonly NodeProbe s_out = new("out", null);

    private static Dictionary<string, double> Values(params (string Name, double Ohms)[] v) =>
        v.ToDictionary(t => t.Name, t => t.Ohms);

    [Theory]
    [InlineData(10.0, 10_000, 10_000)]
    [InlineData(5.0, 90_000, 10_000)]
    [InlineData(2.5, 1_000, 3_300)]
    public void Divider_OutputIsVinTimesR2OverR1PlusR2(double vin, double r1, double r2)
    {
        // Voltage divider rule Vout = Vin R2 / (R1 + R2): textbook (Horowitz & Hill, The Art of Electronics 3rd ed.,
        // 1.2.3; from memory).
        var net = new Netlist(
            "gnd",
            [new("R1", "in", "out"), new("R2", "out", "gnd")],
            [new("V1", "in", "gnd", vin)],
            []
        );
        var sol = NetworkSolver.Solve(net, Values(("R1", r1), ("R2", r2)));
        Assert.Equal(vin * r2 / (r1 + r2), sol.Voltage(s_out), 12);
    }

    [Theory]
    [InlineData(1_000, 2_000, 5_000, 10_000)]
    [InlineData(10_000, 10_000, 4_700, 4_700)]
    public void WheatstoneBridge_BalancedWhenR1OverR2EqualsR3OverR4_DifferentialOutputIsZero(
        double r1,
        double r2,
        double r3,
        double r4
    )
    {
        // Wheatstone bridge balance condition R1/R2 = R3/R4 gives zero differential output: textbook (from memory).
        var sol = NetworkSolver.Solve(Bridge(), Values(("R1", r1), ("R2", r2), ("R3", r3), ("R4", r4)));
        Assert.Equal(0.0, sol.Voltage(new NodeProbe("a", "b")), 12);
    }

    [Fact]
    public void WheatstoneBridge_Unbalanced_MatchesTwoDividerFormula()
    {
        // Differential output = V (R2/(R1+R2) − R4/(R3+R4)): two voltage dividers, textbook (from memory).
        var sol = NetworkSolver.Solve(Bridge(), Values(("R1", 1_000), ("R2", 1_010), ("R3", 1_000), ("R4", 1_000)));
        Assert.Equal(5.0 * ((1010.0 / 2010.0) - 0.5), sol.Voltage(new NodeProbe("a", "b")), 12);
    }

    [Fact]
    public void R2RLadder_EightBits_OutputIsVrefTimesCodeOver256_ForAllCodes()
    {
        // Voltage-mode R-2R ladder: Vout = Vref * code / 2^n, textbook result (Horowitz & Hill 3rd ed. 13.2; from
        // memory).
        var net = Ladder.Netlist(8);
        var values = Ladder.Nominal(8);
        for (var code = 0; code < 256; code++)
        {
            var drive = Enumerable.Range(0, 8).ToDictionary(i => $"B{i}", i => ((code >> i) & 1) == 1 ? 2.56 : 0.0);
            var sol = NetworkSolver.Solve(net, values, drive);
            Assert.Equal(2.56 * code / 256.0, sol.Voltage(new NodeProbe("n7", null)), 12);
        }
    }

    [Theory]
    [InlineData(10_050, 20_100, 6_700)]
    [InlineData(20_000, 20_000, 10_000)]
    public void Parallel_FormulaAndNetwork_Agree(double r1, double r2, double expected)
    {
        // 10.05k || 20.1k = 6.7k: arithmetic check (common practice, no source); 20k || 20k = 10k likewise.
        Assert.Equal(expected, SeriesParallel.Parallel(r1, r2), 6);
        Assert.Equal(expected, EquivalentOf(parallel: true, r1, r2), 6);
    }

    [Fact]
    public void Series_FormulaAndNetwork_Agree()
    {
        // Series resistances add: Ohm's and Kirchhoff's laws (common practice, no source).
        Assert.Equal(30_150, SeriesParallel.Series(10_050, 20_100), 9);
        Assert.Equal(30_150, EquivalentOf(parallel: false, 10_050, 20_100), 6);
    }

    [Fact]
    public void InvertingAmplifier_GainIsMinusR2OverR1()
    {
        // Ideal op-amp inverting amplifier G = −R2/R1: textbook (Horowitz & Hill 3rd ed. 4.2.1; from memory).
        var net = new Netlist(
            "gnd",
            [new("R1", "in", "nm"), new("R2", "nm", "out")],
            [new("V1", "in", "gnd", 0.1)],
            [new("U1", "gnd", "nm", "out")]
        );
        var sol = NetworkSolver.Solve(net, Values(("R1", 1_000), ("R2", 47_000)));
        Assert.Equal(-4.7, sol.Voltage(s_out), 12);
    }

    [Fact]
    public void DifferenceAmplifier_Matched_OutputIsR2OverR1TimesDifference()
    {
        // Four-resistor difference amplifier with R4/R3 = R2/R1: Vout = (R2/R1)(V+ − V−), textbook (from memory).
        var sol = NetworkSolver.Solve(
            DiffAmp(0.7, 0.2),
            Values(("R1", 1_000), ("R2", 10_000), ("R3", 1_000), ("R4", 10_000))
        );
        Assert.Equal(10 * (0.7 - 0.2), sol.Voltage(s_out), 12);
    }

    [Fact]
    public void FloatingNode_IsRejectedAsSingular()
    {
        var net = new Netlist("gnd", [new("R1", "in", "out"), new("R2", "x", "y")], [new("V1", "in", "gnd", 1)], []);
        Assert.Throws<InvalidOperationException>(() => NetworkSolver.Solve(net, Values(("R1", 1e3), ("R2", 1e3))));
    }

    internal static Netlist Bridge() =>
        new(
            "gnd",
            [new("R1", "top", "a"), new("R2", "a", "gnd"), new("R3", "top", "b"), new("R4", "b", "gnd")],
            [new("V1", "top", "gnd", 5.0)],
            []
        );

    internal static Netlist DiffAmp(double vp, double vn) =>
        new(
            "gnd",
            [new("R1", "inn", "nm"), new("R2", "nm", "out"), new("R3", "inp", "np"), new("R4", "np", "gnd")],
            [new("VP", "inp", "gnd", vp), new("VN", "inn", "gnd", vn)],
            [new("U1", "np", "nm", "out")]
        );

    private static double EquivalentOf(bool parallel, double r1, double r2)
    {
        // Combination between 'in' and 'x', 10k reference from 'x' to ground: R = Rref (Vin / Vx − 1).
        NetResistor[] combo = parallel
            ? [new("A", "in", "x"), new("B", "in", "x"), new("REF", "x", "gnd")]
            : [new("A", "in", "m"), new("B", "m", "x"), new("REF", "x", "gnd")];
        var net = new Netlist("gnd", combo, [new("V1", "in", "gnd", 1.0)], []);
        var vx = NetworkSolver
            .Solve(net, Values(("A", r1), ("B", r2), ("REF", 10_000)))
            .Voltage(new NodeProbe("x", null));
        return 10_000 * ((1.0 / vx) - 1);
    }
}
