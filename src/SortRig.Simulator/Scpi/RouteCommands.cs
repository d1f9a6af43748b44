using SortRig.Simulator.Meter;
using static SortRig.Simulator.Scpi.CommonCommands;

namespace SortRig.Simulator.Scpi;

/// <summary>
/// ROUTe subsystem of the scanner (SCPI-99 vol. 2 ch. 15). A multiplexer: at most one channel is
/// closed; with none closed the meter measures the front fixture. A scan list makes INITiate/READ?
/// step through its channels.
/// </summary>
internal static class RouteCommands
{
    public static void Register(CommandTable table) =>
        table
            .Add("ROUTe:CLOSe", (c, _) => Done(() => Close(c)), 1, 1)
            .Add("ROUTe:CLOSe?", (c, _) => Reply(Closed(c)), 0, 1)
            .Add("ROUTe:OPEN", (c, _) => Done(() => Open(c)), 1, 1)
            .Add("ROUTe:OPEN:ALL", (c, _) => Done(() => c.Device.State.ClosedChannel = null))
            .Add("ROUTe:SCAN", (c, _) => Done(() => c.Device.State.ScanList = c.Channels(0)), 1, 1)
            .Add("ROUTe:SCAN?", (c, _) => Reply(ChannelList.Format(c.Device.State.ScanList)));

    private static void Close(ScpiCall call)
    {
        var channels = call.Channels(0);
        if (channels.Count != 1)
        {
            throw new ScpiException(ScpiError.SettingsConflict);
        }

        call.Device.State.ClosedChannel = channels[0];
    }

    private static void Open(ScpiCall call)
    {
        var channels = call.Channels(0);
        if (call.Device.State.ClosedChannel is int closed && channels.Contains(closed))
        {
            call.Device.State.ClosedChannel = null;
        }
    }

    /// <summary>Without a list: the closed channel as a list, "(@)" when none. With a list: 1 or 0 per
    /// channel.</summary>
    private static string Closed(ScpiCall call)
    {
        var closed = call.Device.State.ClosedChannel;
        if (!call.Has(0))
        {
            return ChannelList.Format(closed is int c ? [c] : []);
        }

        return string.Join(',', call.Channels(0).Select(ch => Nr3.Format(ch == closed)));
    }
}
