using SortRig.Instruments.Drivers;
using SortRig.Instruments.Resources;
using SortRig.Instruments.Tests.Support;
using SortRig.Instruments.Transports;

namespace SortRig.Instruments.Tests.Drivers;

public sealed class MeterConnectorTests
{
    private static readonly CancellationToken s_none = CancellationToken.None;

    [Fact]
    public async Task Connect_ModelMatchesProfile_ReturnsWorkingMeter()
    {
        var dmm = new ScriptedDmm();
        dmm.Readings.Enqueue("+1.00001000E+03");
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var meter = await new MeterConnector(new MessageLinkFactory()).ConnectAsync(
            peer.Resource,
            TestProfiles.Simulator(),
            true,
            s_none
        );
        await meter.ConfigureAsync(new ResistanceSetup(1000, 1, false), s_none);
        Assert.Equal(1000.01, (await meter.ReadAsync(s_none)).Value, 9);
    }

    [Fact]
    public async Task Connect_ModelDoesNotMatch_ThrowsSetupExceptionNamingModel()
    {
        var dmm = new ScriptedDmm { Identity = "Other Works,XR-77,1,1" };
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        var ex = await Assert.ThrowsAsync<InstrumentSetupException>(() =>
            new MeterConnector(new MessageLinkFactory()).ConnectAsync(
                peer.Resource,
                TestProfiles.Simulator(),
                true,
                s_none
            )
        );
        Assert.Equal(("model", "'XR-77'"), (ex.Setting, ex.Actual));
    }

    [Fact]
    public async Task OpenSession_TransportNotInProfile_Refused()
    {
        var ex = await Assert.ThrowsAsync<InstrumentSetupException>(() =>
            new MeterConnector(new MessageLinkFactory()).OpenSessionAsync(
                "TCPIP::127.0.0.1::5025::SOCKET",
                TestProfiles.Shipped("handheld-4half-serial"),
                s_none
            )
        );
        Assert.Equal("transport", ex.Setting);
    }

    [Fact]
    public async Task SimulatorResource_ResolvedByHost_OpensTheRealSocket()
    {
        await using var peer = ScriptedScpiPeer.Start(new ScriptedDmm().Handle);
        var factory = new MessageLinkFactory(
            simulatorResolver: (sim, _) =>
                ValueTask.FromResult(
                    sim.Name == "bench-a"
                        ? ResourceStringParser.Parse(peer.Resource)
                        : throw new InvalidOperationException(sim.Name)
                )
        );
        await using var meter = await new MeterConnector(factory).ConnectAsync(
            "SIM::bench-a::INSTR",
            TestProfiles.Simulator(),
            true,
            s_none
        );
        Assert.Equal("SIM-6H", (await meter.IdentifyAsync(s_none)).Model);
    }

    [Theory]
    [InlineData("TCPIP::10.0.0.9::INSTR", "VXI-11")]
    [InlineData("USB::0x1234::0x5678::SN1::INSTR", "USBTMC::/dev/usbtmc")]
    [InlineData("SIM::bench-a::INSTR", "no simulated meter")]
    public async Task UnsupportedResource_LinkExceptionSaysWhatToUse(string resource, string hint)
    {
        var ex = await Assert.ThrowsAsync<InstrumentLinkException>(() =>
            new MessageLinkFactory()
                .OpenAsync(ResourceStringParser.Parse(resource), MessageLinkOptions.Default, null, s_none)
                .AsTask()
        );
        Assert.Contains(hint, ex.Message, StringComparison.Ordinal);
    }
}
