using SortRig.Instruments.Drivers;
using SortRig.Instruments.Scpi;
using SortRig.Instruments.Tests.Support;

namespace SortRig.Instruments.Tests.Drivers;

/// <summary>The probe's profile check against scripted meters that behave well and badly.</summary>
public sealed class ProfileCheckTests
{
    private static readonly CancellationToken s_none = CancellationToken.None;

    [Fact]
    public async Task WellBehavedMeter_EveryCheckPasses()
    {
        var profile = TestProfiles.Simulator();
        await using var peer = ScriptedScpiPeer.Start(new ScriptedDmm().Handle);
        await using var session = await peer.ConnectSessionAsync();
        var report = await new ProfileCheck().RunAsync(session, profile, s_none);
        Assert.True(report.Passed, string.Join("\n", report.Rows));
        // clear, identify, model, 7 ranges, 6 NPLC settings, 4-wire, read, init/fetch, error queue
        Assert.Equal(3 + 7 + 6 + 1 + 1 + 1 + 1, report.Rows.Count);
        Assert.All(report.Rows, r => Assert.Equal(CheckOutcome.Pass, r.Outcome));
        Assert.Equal("SIM-6H", report.Identity!.Model);
    }

    [Fact]
    public async Task MeterRefusesOneRange_OnlyThatRowFails_WithTheInstrumentError()
    {
        var dmm = new ScriptedDmm();
        dmm.Overrides["SENS:RES:RANG 1000000"] = () =>
        {
            dmm.QueueError(-222, "Data out of range");
            return PeerAction.Silent;
        };
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var session = await peer.ConnectSessionAsync();
        var report = await new ProfileCheck().RunAsync(session, TestProfiles.Simulator(), s_none);
        var failed = Assert.Single(report.Rows, r => r.Outcome == CheckOutcome.Fail);
        Assert.Equal("range 1000000 ohm", failed.Check);
        Assert.Contains("-222", failed.Detail, StringComparison.Ordinal);
        Assert.False(report.Passed);
    }

    [Fact]
    public async Task WrongModel_ModelRowFails()
    {
        await using var peer = ScriptedScpiPeer.Start(new ScriptedDmm { Identity = "Other Works,XR-77,1,1" }.Handle);
        await using var session = await peer.ConnectSessionAsync();
        var report = await new ProfileCheck().RunAsync(session, TestProfiles.Simulator(), s_none);
        Assert.Equal(CheckOutcome.Fail, report.Rows.Single(r => r.Check == "model matches profile").Outcome);
    }

    [Fact]
    public async Task MeterGoesSilentOnRead_ReadFailsAsTimeout_LaterChecksSkipped()
    {
        var dmm = new ScriptedDmm();
        dmm.Overrides["READ?"] = () => PeerAction.Silent;
        var profile = TestProfiles.Simulator(
            queryTimeoutSeconds: 1.0 /* long enough that a loaded machine answers every other query */
        );
        await using var peer = ScriptedScpiPeer.Start(dmm.Handle);
        await using var session = await peer.ConnectSessionAsync(new ScpiSessionOptions(profile.Comms.QueryTimeout));
        var report = await new ProfileCheck().RunAsync(session, profile, s_none);
        var read = report.Rows.Single(r => r.Check.StartsWith("read", StringComparison.Ordinal));
        Assert.Equal(CheckOutcome.Fail, read.Outcome);
        Assert.Contains("no reply to 'READ?'", read.Detail, StringComparison.Ordinal);
        Assert.All(report.Rows.SkipWhile(r => r != read).Skip(1), r => Assert.Equal(CheckOutcome.Skipped, r.Outcome));
    }
}
