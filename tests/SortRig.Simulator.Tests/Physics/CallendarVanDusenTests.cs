using SortRig.Simulator.Physics;

namespace SortRig.Simulator.Tests.Physics;

public sealed class CallendarVanDusenTests
{
    // IEC 60751:2008 Table 1 (Pt100 reference table, ohms to 0.01), values from memory.
    [Theory]
    [InlineData(-200, 18.52)]
    [InlineData(-100, 60.26)]
    [InlineData(0, 100.00)]
    [InlineData(30, 111.67)]
    [InlineData(100, 138.51)]
    [InlineData(200, 175.86)]
    public void Ohms_MatchesIec60751Table(double celsius, double tableOhms) =>
        Assert.Equal(tableOhms, CallendarVanDusen.Ohms(celsius), 0.005);

    [Fact]
    public void Ohms_At100C_MatchesFundamentalIntervalRatio()
    {
        // IEC 60751: R(100)/R(0) = 1.3851 (alpha = 0.00385 /K).
        Assert.Equal(1.3851, CallendarVanDusen.Ohms(100) / CallendarVanDusen.Ohms(0), 4);
    }
}
