using SortRig.Simulator.Meter;
using static SortRig.Simulator.Scpi.CommonCommands;

namespace SortRig.Simulator.Scpi;

/// <summary>TRIGger, SAMPle, INITiate, ABORt, FETCh? and READ? (SCPI-99 vol. 2 ch. 22 and 3).</summary>
internal static class TriggerCommands
{
    public static void Register(CommandTable table) =>
        table
            .Add("TRIGger:SOURce", (c, _) => Done(() => SetSource(c)), 1, 1)
            .Add("TRIGger:SOURce?", (c, _) =>
                Reply(c.Device.State.Settings.TriggerSource == TriggerSource.Bus ? "BUS" : "IMM")
            )
            .Add(
                "TRIGger:COUNt",
                (c, _) => Done(() => SetCount(c, MeterSettings.MaxTriggerCount, (s, n) => s with { TriggerCount = n })),
                1,
                1
            )
            .Add("TRIGger:COUNt?", (c, _) => Reply(Nr3.Format((double)c.Device.State.Settings.TriggerCount)))
            .Add(
                "SAMPle:COUNt",
                (c, _) => Done(() => SetCount(c, MeterSettings.MaxSampleCount, (s, n) => s with { SampleCount = n })),
                1,
                1
            )
            .Add("SAMPle:COUNt?", (c, _) => Reply(Nr3.Format((double)c.Device.State.Settings.SampleCount)))
            .Add("INITiate:[IMMediate]", (c, _) => Done(() => Fail(c.Device.Acquisition.Start(c.Device.Lifetime))))
            .Add("ABORt", (c, _) => Done(c.Device.Acquisition.Abort))
            .Add("FETCh?", (c, ct) => new ValueTask<string?>(FetchAsync(c, ct)))
            .Add("READ?", (c, ct) => new ValueTask<string?>(ReadAsync(c, ct)));

    /// <summary>READ? = INITiate + FETCh?; -213 while a run is in progress, -214 with the bus trigger source.</summary>
    public static async Task<string?> ReadAsync(ScpiCall call, CancellationToken ct)
    {
        var device = call.Device;
        if (device.Acquisition.IsRunning)
        {
            throw new ScpiException(ScpiError.InitIgnored);
        }

        if (device.State.Settings.TriggerSource == TriggerSource.Bus)
        {
            throw new ScpiException(ScpiError.TriggerDeadlock);
        }

        Fail(device.Acquisition.Start(device.Lifetime));
        return await FetchAsync(call, ct).ConfigureAwait(false);
    }

    private static async Task<string?> FetchAsync(ScpiCall call, CancellationToken ct)
    {
        var (readings, error) = await call.Device.Acquisition.FetchAsync(ct).ConfigureAwait(false);
        Fail(error);
        return call.Device.Faults.TakeReadingFault()
            ? string.Join(',', Enumerable.Repeat(Nr3.NotANumber, readings!.Count))
            : Nr3.FormatList(readings!);
    }

    private static void SetSource(ScpiCall call)
    {
        var source = call.Keyword(0, "IMMediate", "BUS") == "BUS" ? TriggerSource.Bus : TriggerSource.Immediate;
        call.Device.State.Update(s => s with { TriggerSource = source });
    }

    private static void SetCount(ScpiCall call, int max, Func<MeterSettings, int, MeterSettings> change)
    {
        var value = call.Number(0, NumericParameter.Unitless(1, max, 1));
        if (value < 1 || value > max)
        {
            throw new ScpiException(ScpiError.DataOutOfRange);
        }

        var count = (int)Math.Round(value);
        call.Device.State.Update(s => change(s, count));
    }
}
