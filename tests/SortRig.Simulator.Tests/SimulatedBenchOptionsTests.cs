using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Tests;

public sealed class SimulatedBenchOptionsTests
{
    [Fact]
    public void Validate_Defaults_Pass() => new SimulatedBenchOptions().Validate();

    public static TheoryData<SimulatedBenchOptions, string> BadOptions =>
        new()
        {
            {
                new SimulatedBenchOptions { Seed = -1 },
                "SimulatedBenchOptions.Seed"
            },
            {
                new SimulatedBenchOptions { LineFrequencyHz = 55 },
                "SimulatedBenchOptions.LineFrequencyHz"
            },
            {
                new SimulatedBenchOptions { Pt100Channel = 105 },
                "SimulatedBenchOptions.Pt100Channel"
            },
            {
                new SimulatedBenchOptions { SerialNumber = "A,B" },
                "SimulatedBenchOptions.SerialNumber"
            },
            {
                new SimulatedBenchOptions { Reel = new ReelSpec { Count = 0 } },
                "ReelSpec.Count"
            },
            {
                new SimulatedBenchOptions { Reel = new ReelSpec { TolerancePercent = 25 } },
                "ReelSpec.TolerancePercent"
            },
            {
                new SimulatedBenchOptions
                {
                    Reel = new ReelSpec { Distribution = ValueDistribution.Bimodal(0.05, 0.9) },
                },
                "ReelSpec.Distribution"
            },
            {
                new SimulatedBenchOptions { Ambient = new AmbientSpec { SwingKelvin = 40 } },
                "AmbientSpec.SwingKelvin"
            },
            {
                new SimulatedBenchOptions
                {
                    Operator = new() { WarmKelvinMin = 7, WarmKelvinMax = 6 },
                },
                "OperatorOptions.WarmKelvinMin"
            },
            {
                new SimulatedBenchOptions { Faults = new() { GarbleRate = 1.5 } },
                "FaultOptions.GarbleReplyRate"
            },
        };

    [Theory]
    [MemberData(nameof(BadOptions))]
    public void Constructor_InvalidOption_ThrowsNamingIt(SimulatedBenchOptions options, string option)
    {
        var ex = Assert.ThrowsAny<ArgumentException>(() => new SimulatedBench(options));
        Assert.StartsWith(option, ex.ParamName);
        Assert.Contains(option, ex.Message);
    }
}
