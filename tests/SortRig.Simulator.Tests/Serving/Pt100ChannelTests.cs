using SortRig.Simulator.Physics;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Serving;

public sealed class Pt100ChannelTests
{
    // IEC 60751:2008 Table 1, Pt100 (values from memory): 0 degC -> 100.00, 30 degC -> 111.67, 100 degC -> 138.51 ohm.
    [Theory]
    [InlineData(0, 100.00)]
    [InlineData(30, 111.67)]
    [InlineData(100, 138.51)]
    public async Task Pt100Channel_FourWireReading_MatchesIec60751Table(double ambient, double tableOhms)
    {
        var clock = Benches.FakeClock();
        var options = Benches.Manual() with
        {
            Ambient = new AmbientSpec { MeanCelsius = ambient },
            Pt100Channel = 150,
        };
        await using var bench = new SimulatedBench(options, clock);
        await bench.ExecuteAsync("CONF:FRES 1000,MIN;:ROUT:CLOS (@150)");

        var reply = await VirtualTime.RunAsync(clock, bench.ExecuteAsync("READ?"), TimeSpan.FromSeconds(1));

        Assert.Equal(tableOhms, Numbers.Parse(reply!), 0.005);
    }

    [Fact]
    public async Task Pt100Channel_FollowsASwingingAmbient()
    {
        var clock = Benches.FakeClock();
        var ambient = new AmbientSpec
        {
            MeanCelsius = 20,
            SwingKelvin = 3,
            Period = TimeSpan.FromHours(24),
        };
        await using var bench = new SimulatedBench(Benches.Manual() with { Ambient = ambient }, clock);
        await bench.ExecuteAsync("CONF:FRES 1000;:ROUT:CLOS (@117)");

        clock.Advance(TimeSpan.FromHours(6)); // a quarter period: the peak, 23 degC
        var reply = await VirtualTime.RunAsync(clock, bench.ExecuteAsync("READ?"), TimeSpan.FromMilliseconds(10));

        Assert.Equal(23, bench.AmbientCelsius, 1e-3);
        Assert.Equal(108.96, Numbers.Parse(reply!), 0.01); // IEC 60751 table, 23 degC (from memory)
    }
}
