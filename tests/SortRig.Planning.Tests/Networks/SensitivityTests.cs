using SortRig.Planning.Networks;
using SortRig.Planning.Recipes;

namespace SortRig.Planning.Tests.Networks;

public sealed class SensitivityTests
{
    [Fact]
    public void AdjointSensitivities_MatchCentralFiniteDifferences_OnPerturbedLadder()
    {
        // Reference: central differences (dV/dR ≈ (V(R+h) − V(R−h)) / 2h), a general numerical check (common practice,
        // no source).
        var net = Ladder.Netlist(8);
        var rng = new Random(11);
        var values = Ladder
            .Nominal(8)
            .ToDictionary(kv => kv.Key, kv => kv.Value * (1 + ((rng.NextDouble() - 0.5) * 0.02)));
        var probe = new NodeProbe("n7", null);
        foreach (var bit in new[] { 0, 3, 7 })
        {
            var drive = new Dictionary<string, double> { [$"B{bit}"] = 2.56 };
            var sens = NetworkSolver.Solve(net, values, drive, [probe]).Sensitivities[probe];
            foreach (var (name, r) in values)
            {
                var h = r * 1e-6;
                var up = new Dictionary<string, double>(values) { [name] = r + h };
                var down = new Dictionary<string, double>(values) { [name] = r - h };
                var fd =
                    (
                        NetworkSolver.Solve(net, up, drive).Voltage(probe)
                        - NetworkSolver.Solve(net, down, drive).Voltage(probe)
                    ) / (2 * h);
                // FD round-off is about eps * V / h = 1.4e-14 V/ohm here, so allow that absolutely.
                Assert.True(
                    Math.Abs(fd - sens[name]) <= (1e-7 * Math.Abs(fd)) + 1e-13,
                    $"bit {bit} {name}: adjoint {sens[name]} vs fd {fd}"
                );
            }
        }
    }

    [Fact]
    public void AdjointSensitivities_WithOpAmp_MatchFiniteDifferences()
    {
        var net = NetworkSolverTests.DiffAmp(0.5, -0.5);
        var values = new Dictionary<string, double>
        {
            ["R1"] = 1_003,
            ["R2"] = 9_990,
            ["R3"] = 998,
            ["R4"] = 10_012,
        };
        var probe = new NodeProbe("out", null);
        var sens = NetworkSolver.Solve(net, values, null, [probe]).Sensitivities[probe];
        foreach (var (name, r) in values)
        {
            var h = r * 1e-6;
            var fd =
                (
                    NetworkSolver.Solve(net, new Dictionary<string, double>(values) { [name] = r + h }).Voltage(probe)
                    - NetworkSolver.Solve(net, new Dictionary<string, double>(values) { [name] = r - h }).Voltage(probe)
                ) / (2 * h);
            Assert.Equal(fd, sens[name], 9);
        }
    }

    [Fact]
    public void RatioOutputs_AreScaleInvariant_SoRelativeSensitivitiesSumToZero()
    {
        // A network of resistors and voltage sources is unchanged when every resistance scales together
        // (Euler's theorem for degree-0 homogeneous functions: Σ R ∂V/∂R = 0; common practice, no source).
        var net = Ladder.Netlist(8);
        var probe = new NodeProbe("n7", null);
        var values = Ladder.Nominal(8);
        var sens = NetworkSolver
            .Solve(net, values, new Dictionary<string, double> { ["B6"] = 2.56 }, [probe])
            .Sensitivities[probe];
        Assert.Equal(0.0, values.Sum(kv => kv.Value * sens[kv.Key]), 12);
    }
}
