using static SortRig.Simulator.Scpi.CommonCommands;

namespace SortRig.Simulator.Scpi;

/// <summary>SYSTem subsystem (SCPI-99 vol. 2 ch. 21).</summary>
internal static class SystemCommands
{
    public static void Register(CommandTable table) =>
        table
            .Add("SYSTem:ERRor:[NEXT]?", (c, _) => Reply(c.Device.Errors.Next().Format()))
            .Add("SYSTem:ERRor:COUNt?", (c, _) => Reply(Nr3.Format(c.Device.Errors.Count)))
            .Add("SYSTem:VERSion?", (_, _) => Reply("1999.0"));
}
