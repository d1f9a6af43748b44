using SortRig.Instruments.Profiles;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Tests.Support;

namespace SortRig.Instruments.Tests.Profiles;

/// <summary>The profiles shipped in instruments/ load and say what their files claim.</summary>
public sealed class ShippedProfileTests
{
    [Theory]
    [InlineData("bench-6half-lan")]
    [InlineData("bench-5half")]
    [InlineData("handheld-4half-serial")]
    [InlineData("simulator")]
    public void ShippedProfile_Loads_FamilyIsFileName(string family)
    {
        var profile = MeterProfileLoader.Load(Path.Combine(RepoPaths.Instruments, family + ".yaml"));
        Assert.Equal(family, profile.Family);
        Assert.Equal(family, profile.Spec.Family);
        Assert.NotEmpty(profile.Spec.Ranges);
        Assert.NotEmpty(profile.Spec.Nplcs);
    }

    [Fact]
    public void LoadAll_ReadsEveryShippedProfile()
    {
        var families = MeterProfileLoader.LoadAll(RepoPaths.Instruments).Select(p => p.Family);
        Assert.Equal(["bench-5half", "bench-6half-lan", "handheld-4half-serial", "simulator"], families);
    }

    [Fact]
    public void Simulator_MatchesTheSimulatedMeter()
    {
        // The simulated meter's documented behaviour (docs/simulator.md, the SortRig envelope): *IDN? model SIM-6H,
        // ranges 100 ohm-10 Mohm in decades and a 50 Mohm top range, 1.25 over-range, NPLC 0.04/0.4/1/4/10/40.
        var p = MeterProfileLoader.Load(Path.Combine(RepoPaths.Instruments, "simulator.yaml"));
        Assert.True(p.MatchesModel("SIM-6H"));
        Assert.Equal([100, 1e3, 1e4, 1e5, 1e6, 1e7, 5e7], p.Spec.Ranges.Select(r => r.FullScale));
        Assert.All(p.Spec.Ranges, r => Assert.Equal(1.25, r.OverRangeFactor));
        Assert.Equal([0.04, 0.4, 1, 4, 10, 40], p.Spec.Nplcs.Select(n => n.Nplc));
        Assert.True(p.TwoWire && p.Spec.FourWire);
        Assert.Contains(TransportKind.Simulator, p.Comms.Transports);
        Assert.Equal("SENS:FRES:RANG 10000", p.Commands.Range.Render(("function", "FRES"), ("range", 10000.0)));
    }

    [Theory]
    [InlineData("bench-6half-lan")]
    [InlineData("bench-5half")]
    [InlineData("handheld-4half-serial")]
    [InlineData("simulator")]
    public void Header_SaysTheFiguresAreInventedForSortRig(string family)
    {
        // Originality rule (RULES.md): shipped figures are our own, and the file says so before its first key.
        var lines = File.ReadLines(Path.Combine(RepoPaths.Instruments, family + ".yaml"))
            .TakeWhile(l => l.StartsWith('#'));
        Assert.Contains(lines, l => l.Contains("invented for SortRig", StringComparison.Ordinal));
        Assert.DoesNotContain(File.ReadLines(Path.Combine(RepoPaths.Instruments, family + ".yaml")), l =>
            l.Contains("from memory", StringComparison.Ordinal)
        );
    }

    [Fact]
    public void BenchProfiles_DoNotClaimTheSimulator()
    {
        var others = MeterProfileLoader.LoadAll(RepoPaths.Instruments).Where(p => p.Family != "simulator");
        Assert.All(others, p => Assert.False(p.MatchesModel("SIM-6H"), p.Family));
    }

    [Fact]
    public void Handheld_SerialOnly_TwoWireOnly_OneFixedNplc()
    {
        var p = MeterProfileLoader.Load(Path.Combine(RepoPaths.Instruments, "handheld-4half-serial.yaml"));
        Assert.Equal([TransportKind.Serial], p.Comms.Transports);
        Assert.False(p.Spec.FourWire);
        Assert.Single(p.Spec.Nplcs);
        Assert.Null(p.Commands.Nplc);
        Assert.Equal("\r\n", p.Comms.Terminator);
        Assert.Equal(9600, p.Comms.Serial!.BaudRate);
    }
}
