using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Scpi;

/// <summary>The command tree in-process (no time passes for these commands).</summary>
public sealed class CommandTests : IAsyncLifetime
{
    private readonly SimulatedBench _bench = new(Benches.Manual(), Benches.FakeClock());

    public Task InitializeAsync() => Task.CompletedTask;

    public async Task DisposeAsync() => await _bench.DisposeAsync();

    [Fact]
    public async Task Idn_ReturnsMakerModelSerialVersion() =>
        Assert.Equal("SortRig,SIM-6H,SIM000007,1.0", await Q("*IDN?"));

    [Theory]
    [InlineData("RES:RANG 1000", "RES:RANG?", "+1.00000000E+03")]
    [InlineData("SENS:RES:RANG 5000", "RES:RANG?", "+1.00000000E+04")]
    [InlineData("sense:resistance:range 2 kohm", "RES:RANG?", "+1.00000000E+04")]
    [InlineData("RES:RANG MIN", "RES:RANG?", "+1.00000000E+02")]
    [InlineData("FRES:RANG MAX", "FRES:RANG?", "+5.00000000E+07")]
    [InlineData("RES:RANG 1 MOHM", "RES:RANG?", "+1.00000000E+06")]
    [InlineData("RES:NPLC 10", "RES:NPLC?", "+1.00000000E+01")]
    [InlineData("resistance:nplcycles 0.04", "SENSE:RESISTANCE:NPLCYCLES?", "+4.00000000E-02")]
    [InlineData("FRES:NPLC MAX", "FRES:NPLC?", "+4.00000000E+01")]
    [InlineData("RES:RANG:AUTO OFF", "RES:RANG:AUTO?", "0")]
    [InlineData("RES:RANG 100", "RES:RANG:AUTO?", "0")]
    [InlineData("TRIG:SOUR BUS", "TRIG:SOUR?", "BUS")]
    [InlineData("TRIGGER:COUNT 7", "TRIG:COUN?", "+7.00000000E+00")]
    [InlineData("SAMP:COUN 12", "SAMP:COUN?", "+1.20000000E+01")]
    [InlineData("CONF:FRES 100,MIN", "CONF?", "\"FRES +1.00000000E+02,+1.00000000E-05\"")]
    [InlineData("ROUT:CLOS (@103)", "ROUT:CLOS?", "(@103)")]
    [InlineData("ROUT:SCAN (@101:103,117)", "ROUT:SCAN?", "(@101,102,103,117)")]
    public async Task Setting_QueriesBack(string command, string query, string expected)
    {
        await Q(command);
        Assert.Equal(expected, await Q(query));
        Assert.Equal("0,\"No error\"", await Q("SYST:ERR?"));
    }

    [Fact]
    public async Task Rst_RestoresDocumentedDefaults()
    {
        await Q("CONF:FRES 100;:FRES:NPLC 40;:TRIG:SOUR BUS;:ROUT:CLOS (@101)");

        await Q("*RST");

        Assert.Equal("\"RES\"", await Q("FUNC?"));
        Assert.Equal("1", await Q("RES:RANG:AUTO?"));
        Assert.Equal("+1.00000000E+00", await Q("RES:NPLC?"));
        Assert.Equal("IMM", await Q("TRIG:SOUR?"));
        Assert.Equal("(@)", await Q("ROUT:CLOS?"));
    }

    private Task<string?> Q(string message) => _bench.ExecuteAsync(message);

    private async Task<string> Q2(string query) =>
        await Q(query) ?? throw new InvalidOperationException($"No reply to {query}");
}
