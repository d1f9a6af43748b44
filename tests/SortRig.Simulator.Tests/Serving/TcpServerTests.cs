using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Serving;

/// <summary>Real TCP on 127.0.0.1, bench clock 1000x real time.</summary>
public sealed class TcpServerTests : IAsyncLifetime
{
    private readonly SimulatedBench _bench = new(Benches.Manual(), new ScaledTimeProvider(1000));
    private ScpiTestClient _client = null!;

    public async Task InitializeAsync() => _client = await ScpiTestClient.ConnectAsync(await _bench.StartTcpAsync());

    public async Task DisposeAsync()
    {
        await _client.DisposeAsync();
        await _bench.DisposeAsync();
    }

    [Fact]
    public async Task Idn_OverTcp_RepliesOneLine() => Assert.Equal(_bench.Identity, await _client.QueryAsync("*IDN?"));

    [Fact]
    public async Task SequentialClients_EachGetServed_StateIsShared()
    {
        await _client.SendAsync("RES:NPLC 10");
        // A command has no reply: *OPC? waits until it has run (IEEE 488.2 operation complete query, from memory), so
        // the next client cannot be served before the old connection's last command (they are read on separate
        // sockets).
        Assert.Equal("1", await _client.QueryAsync("*OPC?"));
        _client.Close();

        for (var i = 0; i < 3; i++)
        {
            await using var next = await ScpiTestClient.ConnectAsync(_bench.TcpEndpoint!);
            Assert.Equal("+1.00000000E+01", await next.QueryAsync("RES:NPLC?"));
        }
    }

    [Fact]
    public async Task Read_OpenFixture_ReturnsOverflow() =>
        Assert.Equal("+9.90000000E+37", await _client.QueryAsync("READ?"));

    [Fact]
    public async Task MeasureQuery_PartInFixture_ReadsItsTrueValue()
    {
        _bench.Fixture.Insert(_bench.Reel[3]);
        await _client.QueryAsync("*OPC?");

        var value = await _client.QueryNumberAsync("MEAS:RES? 10000");

        Assert.Equal(_bench.Truth(3), value, 10_000 * 5e-6); // 1 NPLC: 0.7 ppm noise, 1 ppm step
    }

    [Fact]
    public async Task PipelinedQueries_FirstIsInterrupted_Minus410()
    {
        // IEEE 488.2 sec. 6.3.2.3: a new message before the reply was read interrupts the query.
        await _client.SendRawAsync("READ?\n*IDN?\n");

        Assert.Equal(_bench.Identity, await _client.ReadLineAsync());
        Assert.Equal("-410,\"Query INTERRUPTED\"", await _client.QueryAsync("SYST:ERR?"));
    }

    [Fact]
    public async Task UnterminatedQueryAtDisconnect_Minus420ForTheNextClient()
    {
        await _client.SendRawAsync("*IDN?");
        _client.Close();

        await using var next = await ScpiTestClient.ConnectAsync(_bench.TcpEndpoint!);
        var error = string.Empty;
        for (var i = 0; i < 200 && !error.StartsWith("-420", StringComparison.Ordinal); i++)
        {
            error = await next.QueryAsync("SYST:ERR?");
            await Task.Delay(5);
        }

        Assert.Equal("-420,\"Query UNTERMINATED\"", error);
    }

    [Fact]
    public async Task OverlongLine_Minus363()
    {
        await _client.SendAsync(new string('A', 5000));

        Assert.Equal("-363,\"Input buffer overrun\"", await _client.QueryAsync("SYST:ERR?"));
    }

    [Fact]
    public async Task SideChannel_InsertsAndReportsTheFixture()
    {
        Assert.Equal("0", await _client.QueryAsync("SIM:FIXT:STAT?"));
        await _client.SendAsync("SIM:FIXT:INS 4,3.5");

        Assert.Equal("1", await _client.QueryAsync("SIMULATION:FIXTURE:STATE?"));
        Assert.Equal("4", await _client.QueryAsync("SIM:PART:IND?"));
        Assert.Equal(_bench.Truth(4), await _client.QueryNumberAsync("SIM:PART:TRUE? 4"), 1e-4);
        Assert.Equal("20", await _client.QueryAsync("SIM:REEL:COUN?"));
        await _client.SendAsync("SIM:FIXT:REM");
        Assert.Equal("-1", await _client.QueryAsync("SIM:PART:IND?"));
        Assert.Equal("0,\"No error\"", await _client.QueryAsync("SYST:ERR?"));
    }
}
