using SortRig.Simulator.Meter;
using static SortRig.Simulator.Scpi.CommonCommands;

namespace SortRig.Simulator.Scpi;

/// <summary>[SENSe:] subsystem: range, autorange, NPLC and autozero for RES and FRES (SCPI-99 vol. 2 ch. 18).</summary>
internal static class SenseCommands
{
    public static readonly NumericParameter RangeParameter = NumericParameter.Ohms(
        ResistanceRanges.Min,
        ResistanceRanges.Max,
        ResistanceRanges.Default
    );

    public static readonly NumericParameter NplcParameter = NumericParameter.Unitless(
        NplcSetting.All[0].Nplc,
        NplcSetting.All[^1].Nplc,
        NplcSetting.Default.Nplc
    );

    public static void Register(CommandTable table)
    {
        RegisterFunction(table, "RESistance", MeterFunction.Resistance);
        RegisterFunction(table, "FRESistance", MeterFunction.FourWireResistance);
        table
            .Add("[SENSe]:FUNCtion", (c, _) => Done(() => SetFunction(c)), 1, 1)
            .Add("[SENSe]:FUNCtion?", (c, _) => Reply(FunctionName(c.Device.State.Settings.Function, quoted: true)))
            .Add(
                "[SENSe]:ZERO:AUTO",
                (c, _) => Done(() => c.Device.State.Update(s => s with { AutoZero = c.Boolean(0) })),
                1,
                1
            )
            .Add("[SENSe]:ZERO:AUTO?", (c, _) => Reply(Nr3.Format(c.Device.State.Settings.AutoZero)));
    }

    public static string FunctionName(MeterFunction function, bool quoted)
    {
        var name = function == MeterFunction.Resistance ? "RES" : "FRES";
        return quoted ? $"\"{name}\"" : name;
    }

    /// <summary>RANGe &lt;value&gt;: the smallest range that covers the value; -222 above 50 MOhm or at or below
    /// 0.</summary>
    public static double ParseRange(ScpiCall call, int index)
    {
        var value = call.Number(index, RangeParameter);
        return value > 0 && ResistanceRanges.Covering(value) is double range
            ? range
            : throw new ScpiException(ScpiError.DataOutOfRange);
    }

    /// <summary>
    /// NPLCycles &lt;value&gt;: one of the allowed settings exactly (our own rule, no rounding); -222 outside the
    /// lowest to highest setting, -224 for a value between them that is not a setting (SCPI-99 vol. 2 ch. 21 meanings).
    /// </summary>
    public static double ParseNplc(ScpiCall call, int index)
    {
        var value = call.Number(index, NplcParameter);
        if (value < NplcSetting.All[0].Nplc * (1 - 1e-9) || value > NplcSetting.All[^1].Nplc * (1 + 1e-9))
        {
            throw new ScpiException(ScpiError.DataOutOfRange);
        }

        return NplcSetting.Find(value)?.Nplc ?? throw new ScpiException(ScpiError.IllegalParameterValue);
    }

    private static void RegisterFunction(CommandTable table, string node, MeterFunction function)
    {
        var prefix = $"[SENSe]:{node}";
        table
            .Add(
                $"{prefix}:RANGe",
                (c, _) => Done(() => Change(c, function, f => f with { Range = ParseRange(c, 0), AutoRange = false })),
                1,
                1
            )
            .Add(
                $"{prefix}:RANGe?",
                (c, _) => Reply(Nr3.Format(c.Has(0) ? ParseRange(c, 0) : Settings(c, function).Range)),
                0,
                1
            )
            .Add(
                $"{prefix}:RANGe:AUTO",
                (c, _) => Done(() => Change(c, function, f => f with { AutoRange = c.Boolean(0) })),
                1,
                1
            )
            .Add($"{prefix}:RANGe:AUTO?", (c, _) => Reply(Nr3.Format(Settings(c, function).AutoRange)))
            .Add(
                $"{prefix}:NPLCycles",
                (c, _) => Done(() => Change(c, function, f => f with { Nplc = ParseNplc(c, 0) })),
                1,
                1
            )
            .Add(
                $"{prefix}:NPLCycles?",
                (c, _) => Reply(Nr3.Format(c.Has(0) ? ParseNplc(c, 0) : Settings(c, function).Nplc)),
                0,
                1
            )
            .Add($"{prefix}:RESolution?", (c, _) => Reply(Nr3.Format(Resolution(Settings(c, function)))));
    }

    private static FunctionSettings Settings(ScpiCall call, MeterFunction function) =>
        call.Device.State.Settings.For(function);

    private static double Resolution(FunctionSettings settings) =>
        (NplcSetting.Find(settings.Nplc) ?? NplcSetting.Default).Step(settings.Range);

    private static void Change(ScpiCall call, MeterFunction function, Func<FunctionSettings, FunctionSettings> change)
    {
        // Parse before touching the state so that a bad parameter leaves the setting unchanged.
        var updated = change(Settings(call, function));
        call.Device.State.Update(s => s.With(function, updated));
    }

    private static void SetFunction(ScpiCall call)
    {
        var name = call.Parameters[0].Trim('"', '\'');
        var function =
            ScpiParameters.Keyword(name, "RESistance", "FRESistance") == "RESistance"
                ? MeterFunction.Resistance
                : MeterFunction.FourWireResistance;
        call.Device.State.Update(s => s with { Function = function });
    }
}
