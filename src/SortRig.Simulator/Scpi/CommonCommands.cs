using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Scpi;

/// <summary>IEEE 488.2 common commands (IEEE 488.2-1992 sec. 10).</summary>
internal static class CommonCommands
{
    public static void Register(CommandTable table) =>
        table
            .Add("*IDN?", (c, _) => Reply(c.Device.Identity))
            .Add("*RST", (c, _) => Done(c.Device.Reset))
            .Add("*CLS", (c, _) => Done(() => Clear(c.Device)))
            .Add("*OPC", (c, _) => Done(() => c.Device.Status.Set(StatusRegisters.OperationComplete)))
            .Add("*OPC?", async (c, ct) =>
            {
                await c.Device.Acquisition.WaitIdleAsync(ct).ConfigureAwait(false);
                return "1";
            })
            .Add("*WAI", async (c, ct) =>
            {
                await c.Device.Acquisition.WaitIdleAsync(ct).ConfigureAwait(false);
                return null;
            })
            .Add("*ESR?", (c, _) => Reply(Nr3.Format(c.Device.Status.ReadAndClearEvents())))
            .Add("*ESE", (c, _) => Done(() => c.Device.Status.EventEnable = c.Count(0, 0, 255)), 1, 1)
            .Add("*ESE?", (c, _) => Reply(Nr3.Format(c.Device.Status.EventEnable)))
            .Add(
                "*SRE",
                (c, _) =>
                    Done(() =>
                        c.Device.Status.ServiceRequestEnable = c.Count(0, 0, 255) & ~StatusRegisters.MasterSummary
                    ),
                1,
                1
            )
            .Add("*SRE?", (c, _) => Reply(Nr3.Format(c.Device.Status.ServiceRequestEnable)))
            .Add("*STB?", (c, _) => Reply(Nr3.Format(c.Device.Status.StatusByte(c.Device.Errors.Count))))
            .Add("*TRG", (c, _) => Done(() => Fail(c.Device.Acquisition.Trigger())))
            .Add("*TST?", (_, _) => Reply("0"));

    private static void Clear(DeviceContext device)
    {
        device.Errors.Clear();
        device.Status.ClearEvents();
    }

    internal static ValueTask<string?> Reply(string text) => ValueTask.FromResult<string?>(text);

    internal static ValueTask<string?> Done(Action action)
    {
        action();
        return ValueTask.FromResult<string?>(null);
    }

    /// <summary>Raises the error when there is one.</summary>
    internal static void Fail(ScpiError? error)
    {
        if (error is ScpiError e)
        {
            throw new ScpiException(e);
        }
    }
}
