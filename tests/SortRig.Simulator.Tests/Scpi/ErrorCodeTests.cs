using SortRig.Simulator.Tests.Support;

namespace SortRig.Simulator.Tests.Scpi;

/// <summary>Error reporting in-process: the queue, its codes and the status registers.</summary>
public sealed class ErrorCodeTests : IAsyncLifetime
{
    private readonly SimulatedBench _bench = new(Benches.Manual(), Benches.FakeClock());

    public Task InitializeAsync() => Task.CompletedTask;

    public async Task DisposeAsync() => await _bench.DisposeAsync();

    // SCPI-99 vol. 2 ch. 21 error codes and messages.
    [Theory]
    [InlineData("FOO:BAR 1", "-113,\"Undefined header\"")]
    [InlineData("RES:NPLC 5", "-224,\"Illegal parameter value\"")] // between settings 4 and 10 (our own rule)
    [InlineData("RES:NPLC 50", "-222,\"Data out of range\"")] // above the longest setting, 40
    [InlineData("RES:RANG 6e7", "-222,\"Data out of range\"")] // above the 50 MOhm top range
    [InlineData("TRIG:COUN 0", "-222,\"Data out of range\"")]
    [InlineData("TRIG:COUN 5001", "-222,\"Data out of range\"")] // our own limits: 5000 triggers,
    [InlineData("SAMP:COUN 1001", "-222,\"Data out of range\"")] // 1000 samples per trigger,
    [InlineData("TRIG:COUN 21;:SAMP:COUN 1000;:INIT", "-223,\"Too much data\"")] // 20 000 readings per INITiate
    [InlineData("RES:NPLC", "-109,\"Missing parameter\"")]
    [InlineData("RES:NPLC 1,2", "-108,\"Parameter not allowed\"")]
    [InlineData("*RST 1", "-108,\"Parameter not allowed\"")]
    [InlineData("RES:NPLC fast", "-104,\"Data type error\"")]
    [InlineData("TRIG:SOUR EXT", "-224,\"Illegal parameter value\"")]
    [InlineData("RES:RANG 10 VOLT", "-131,\"Invalid suffix\"")]
    [InlineData("RES:RANG (1", "-102,\"Syntax error\"")]
    [InlineData("RES::RANG 1", "-102,\"Syntax error\"")]
    [InlineData("*IDN", "-100,\"Command error\"")]
    [InlineData("FETC?", "-230,\"Data corrupt or stale\"")]
    [InlineData("*TRG", "-211,\"Trigger ignored\"")]
    [InlineData("ROUT:CLOS (@101,102)", "-221,\"Settings conflict\"")]
    [InlineData("ROUT:CLOS (@150)", "-222,\"Data out of range\"")]
    public async Task BadMessage_QueuesStandardError(string message, string error)
    {
        await Q(message);

        Assert.Equal(error, await Q("SYST:ERR?"));
        Assert.Equal("0,\"No error\"", await Q("SYST:ERR:NEXT?"));
    }

    [Fact]
    public async Task BadNplc_LeavesSettingUnchanged()
    {
        await Q("RES:NPLC 10");
        await Q("RES:NPLC 3");

        Assert.Equal("+1.00000000E+01", await Q("RES:NPLC?"));
    }

    [Fact]
    public async Task CompoundMessage_RelativePathAndJoinedReplies()
    {
        // SCPI-99 vol. 1 sec. 6.2.4: after ';' the header continues at the previous node.
        var reply = await Q("SENS:RES:RANG 1000;NPLC 40;RANG?;NPLC?;*OPC?");

        Assert.Equal("+1.00000000E+03;+4.00000000E+01;1", reply);
    }

    [Fact]
    public async Task CommandError_DiscardsRestOfMessage_ExecutionErrorDoesNot()
    {
        await Q("RES:NPLC 10;BOGUS;RES:NPLC 40");
        Assert.Equal("+1.00000000E+01", await Q("RES:NPLC?"));

        await Q("RES:NPLC 7;RES:NPLC 0.4");
        Assert.Equal("+4.00000000E-01", await Q("RES:NPLC?"));
    }

    [Fact]
    public async Task Status_CommandErrorSetsEsrBit5AndStbErrorBit()
    {
        await Q("*CLS;*ESE 32;*SRE 32");
        await Q("NOPE");

        // IEEE 488.2 sec. 11.5.1: CME is ESR bit 5; SCPI-99 vol. 1 sec. 9.1: error queue not empty is STB bit 2.
        Assert.Equal(4 | 32 | 64, int.Parse(await Q2("*STB?")));
        Assert.Equal(32, int.Parse(await Q2("*ESR?")));
        Assert.Equal(0, int.Parse(await Q2("*ESR?")));
        await Q("*CLS");
        Assert.Equal(0, int.Parse(await Q2("*STB?")));
    }

    [Fact]
    public async Task ErrorQueue_OverflowsAtSixteenWithMinus350()
    {
        for (var i = 0; i < 25; i++)
        {
            await Q("NOPE");
        }

        var errors = new List<string>();
        for (var i = 0; i < 17; i++)
        {
            errors.Add((await Q("SYST:ERR?"))!);
        }

        // A queue of 16 (our own length, docs/simulator.md): 15 errors, then -350 in place of the 16th.
        Assert.All(errors.Take(15), e => Assert.StartsWith("-113,", e));
        Assert.Equal("-350,\"Queue overflow\"", errors[15]);
        Assert.Equal("0,\"No error\"", errors[16]);
    }

    private Task<string?> Q(string message) => _bench.ExecuteAsync(message);

    private async Task<string> Q2(string query) =>
        await Q(query) ?? throw new InvalidOperationException($"No reply to {query}");
}
