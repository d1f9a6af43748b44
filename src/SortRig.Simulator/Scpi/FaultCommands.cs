using SortRig.Simulator.Faults;
using static SortRig.Simulator.Scpi.CommonCommands;

namespace SortRig.Simulator.Scpi;

/// <summary>SIMulation:FAULt: arm faults, set random rates and the reply delay, read the fault counts
/// (test-only).</summary>
internal static class FaultCommands
{
    private static readonly string[] s_names = ["DROP", "DELay", "GARBle", "ERRor", "RESet", "NAN"];
    private static readonly NumericParameter s_seconds = NumericParameter.Seconds(0, 600, 5);
    private static readonly NumericParameter s_rate = NumericParameter.Unitless(0, 1, 0);

    public static void Register(CommandTable table) =>
        table
            .Add("SIMulation:FAULt:INJect", (c, _) => Done(() => c.Device.Faults.Inject(Kind(c, 0))), 1, 1)
            .Add(
                "SIMulation:FAULt:COUNt?",
                (c, _) =>
                    Reply(Nr3.Format(c.Has(0) ? c.Device.Faults.Log.Count(Kind(c, 0)) : c.Device.Faults.Log.Total)),
                0,
                1
            )
            .Add("SIMulation:FAULt:DELay", (c, _) => Done(() => c.Device.Faults.ReplyDelay = Seconds(c)), 1, 1)
            .Add("SIMulation:FAULt:DELay?", (c, _) => Reply(Nr3.Format(c.Device.Faults.ReplyDelay.TotalSeconds)))
            .Add("SIMulation:FAULt:RATE", (c, _) => Done(() => c.Device.Faults.SetRate(Kind(c, 0), Rate(c, 1))), 2, 2)
            .Add("SIMulation:FAULt:RATE?", (c, _) => Reply(Nr3.Format(c.Device.Faults.Rate(Kind(c, 0)))), 1, 1);

    /// <summary>DROP | DELay | GARBle | ERRor | RESet | NAN.</summary>
    private static FaultKind Kind(ScpiCall call, int index) =>
        (FaultKind)Array.IndexOf(s_names, call.Keyword(index, s_names));

    private static TimeSpan Seconds(ScpiCall call)
    {
        var value = call.Number(0, s_seconds);
        SimulationCommands.OutOfRangeUnless(value is >= 0 and <= 600);
        return TimeSpan.FromSeconds(value);
    }

    private static double Rate(ScpiCall call, int index)
    {
        var value = call.Number(index, s_rate);
        SimulationCommands.OutOfRangeUnless(value is >= 0 and <= 1);
        return value;
    }
}
