using Microsoft.Extensions.Time.Testing;
using SortRig.Simulator.Faults;
using SortRig.Simulator.Meter;
using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Faults;

/// <summary>Each fault kind as a client sees it over real TCP; bench on a FakeTimeProvider.</summary>
public sealed class FaultTests : IAsyncLifetime
{
    private readonly FakeTimeProvider _clock = Benches.FakeClock();
    private SimulatedBench _bench = null!;
    private ScpiTestClient _client = null!;

    public async Task InitializeAsync()
    {
        _bench = new SimulatedBench(Benches.Manual(), _clock);
        _client = await ScpiTestClient.ConnectAsync(await _bench.StartTcpAsync());
    }

    public async Task DisposeAsync()
    {
        await _client.DisposeAsync();
        await _bench.DisposeAsync();
    }

    [Fact]
    public async Task Drop_ClosesTheSocketInsteadOfReplying_NextClientIsServed()
    {
        await _client.SendAsync("SIM:FAUL:INJ DROP");
        await _client.SendAsync("*IDN?");

        Assert.Null(await _client.ReadLineAsync());
        await using var next = await ScpiTestClient.ConnectAsync(_bench.TcpEndpoint!);
        Assert.Equal("1", await next.QueryAsync("SIM:FAUL:COUN? DROP"));
        Assert.Equal(1, _bench.Faults.Log.Count(FaultKind.DropConnection));
    }

    [Fact]
    public async Task Delay_ReplyComesOnlyAfterTheVirtualDelay()
    {
        await _client.SendAsync("SIM:FAUL:DEL 7");
        _bench.Faults.Inject(FaultKind.DelayReply);
        var reply = _client.BeginReadLine();
        await _client.SendAsync("*IDN?");

        await Task.Delay(300);
        _clock.Advance(TimeSpan.FromSeconds(6.9));
        await Task.Delay(100);
        Assert.False(reply.IsCompleted);

        _clock.Advance(TimeSpan.FromSeconds(0.1));
        Assert.Equal(_bench.Identity, await reply.WaitAsync(ScpiTestClient.Guard));
        Assert.Equal(1, _bench.Faults.Log.Count(FaultKind.DelayReply));
    }

    [Fact]
    public async Task Garble_ReplyDiffersFromTheTrueOne()
    {
        await _client.SendAsync("SIM:FAUL:INJ GARB");

        var garbled = await _client.QueryAsync("*IDN?");

        Assert.NotEqual(_bench.Identity, garbled);
        Assert.Equal(_bench.Identity, await _client.QueryAsync("*IDN?"));
        Assert.Equal("1", await _client.QueryAsync("SIM:FAUL:COUN? GARB"));
    }

    [Fact]
    public async Task NotANumber_ReadingReplyIsTheScpiNaN_OtherRepliesUntouched()
    {
        await _bench.ExecuteAsync("SIM:FIXT:INS 0,0");
        await _bench.ExecuteAsync("SIM:FAUL:INJ NAN");

        // Armed for a reading: a reply that is not a reading passes untouched and leaves it armed.
        Assert.Equal(_bench.Identity, await _bench.ExecuteAsync("*IDN?"));
        var nan = await VirtualTime.RunAsync(
            _clock,
            _bench.ExecuteAsync("MEAS:RES? 10000"),
            TimeSpan.FromMilliseconds(41)
        );
        var next = await VirtualTime.RunAsync(
            _clock,
            _bench.ExecuteAsync("MEAS:RES? 10000"),
            TimeSpan.FromMilliseconds(41)
        );

        // 9.91E37 is SCPI's not-a-number (SCPI-99 vol. 1 sec. 7.2.1.5), in the meter's NR3 form (IEEE 488.2 sec.
        // 8.7.4).
        Assert.Equal("+9.91000000E+37", nan);
        Assert.InRange(double.Parse(next!, System.Globalization.CultureInfo.InvariantCulture), 9_000, 11_000);
        Assert.Equal(1, _bench.Faults.Log.Count(FaultKind.NotANumber));
    }

    [Fact]
    public async Task SpuriousError_AppearsInTheErrorQueue()
    {
        await _client.SendAsync("SIM:FAUL:INJ ERR");

        Assert.Equal("-310,\"System error\"", await _client.QueryAsync("SYST:ERR?"));
        Assert.Equal(1, _bench.Faults.Log.Count(FaultKind.SpuriousError));
    }

    [Fact]
    public async Task SilentReset_SettingsReturnToDefaultsWithoutAnError()
    {
        await _client.SendAsync("RES:NPLC 40;RANG 1000");
        await _client.SendAsync("SIM:FAUL:INJ RES");

        Assert.Equal("+1.00000000E+00", await _client.QueryAsync("RES:NPLC?"));
        Assert.Equal("1", await _client.QueryAsync("RES:RANG:AUTO?"));
        Assert.Equal("0,\"No error\"", await _client.QueryAsync("SYST:ERR?"));
        Assert.Equal(1, _bench.Faults.Log.Count(FaultKind.SilentReset));
    }

    [Fact]
    public async Task RandomRate_FiresAboutThatOftenAndIsCounted()
    {
        _bench.Faults.SetRate(FaultKind.SpuriousError, 0.2);
        for (var i = 0; i < 200; i++)
        {
            await _client.QueryAsync("*OPC?");
        }

        _bench.Faults.SetRate(FaultKind.SpuriousError, 0);

        // Binomial(200, 0.2): mean 40, sd 5.7; 23..57 is +-3 sd (textbook identity: np, sqrt(np(1-p))). The queue keeps
        // at most ErrorQueue.Capacity (16).
        var fired = _bench.Faults.Log.Count(FaultKind.SpuriousError);
        Assert.InRange(fired, 23, 57);
        Assert.Equal(
            Math.Min(fired, ErrorQueue.Capacity),
            int.Parse(await _client.QueryAsync("SYST:ERR:COUN?"), System.Globalization.CultureInfo.InvariantCulture)
        );
    }
}
