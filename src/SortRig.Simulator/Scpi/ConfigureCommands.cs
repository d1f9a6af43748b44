using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Scpi;

/// <summary>
/// CONFigure and MEASure (SCPI-99 vol. 2 ch. 3): set function, range and resolution in one step,
/// with a single immediate trigger and sample. MEASure? then reads as READ? does.
/// </summary>
internal static class ConfigureCommands
{
    public static void Register(CommandTable table)
    {
        foreach (
            var (node, function) in new[]
            {
                ("RESistance", MeterFunction.Resistance),
                ("FRESistance", MeterFunction.FourWireResistance),
            }
        )
        {
            table
                .Add($"CONFigure:{node}", (c, _) => CommonCommands.Done(() => Configure(c, function)), 0, 2)
                .Add(
                    $"MEASure:{node}?",
                    async (c, ct) =>
                    {
                        Configure(c, function);
                        return await TriggerCommands.ReadAsync(c, ct).ConfigureAwait(false);
                    },
                    0,
                    2
                );
        }

        table.Add("CONFigure?", (c, _) => CommonCommands.Reply(Describe(c.Device.State.Settings)));
    }

    /// <summary>
    /// Range: a value, MIN, MAX (fixed) or AUTO / DEF (autorange). Resolution in ohms: MIN = finest
    /// (40 NPLC), MAX = coarsest (0.04 NPLC), DEF = 1 NPLC, a value = the fastest NPLC whose step is at most
    /// that value on the chosen range (-222 if none; -221 with autorange, where the step is not fixed).
    /// </summary>
    public static void Configure(ScpiCall call, MeterFunction function)
    {
        var auto =
            !call.Has(0)
            || ScpiParameters.IsKeyword(call.Parameters[0], "AUTO")
            || ScpiParameters.IsKeyword(call.Parameters[0], "DEFault");
        var range = auto ? ResistanceRanges.Default : SenseCommands.ParseRange(call, 0);
        var nplc = call.Has(1) ? ResolutionToNplc(call, auto, range) : NplcSetting.Default.Nplc;
        call.Device.Acquisition.Abort();
        call.Device.State.Update(s =>
            s.With(function, new FunctionSettings(range, auto, nplc)) with
            {
                Function = function,
                TriggerSource = TriggerSource.Immediate,
                TriggerCount = 1,
                SampleCount = 1,
            }
        );
    }

    private static double ResolutionToNplc(ScpiCall call, bool auto, double range)
    {
        var text = call.Parameters[1];
        if (ScpiParameters.IsKeyword(text, "MINimum"))
        {
            return NplcSetting.All[^1].Nplc;
        }

        if (ScpiParameters.IsKeyword(text, "MAXimum"))
        {
            return NplcSetting.All[0].Nplc;
        }

        if (ScpiParameters.IsKeyword(text, "DEFault"))
        {
            return NplcSetting.Default.Nplc;
        }

        var wanted = call.Number(1, NumericParameter.Ohms(null, null, null));
        if (auto)
        {
            throw new ScpiException(ScpiError.SettingsConflict);
        }

        var fit = NplcSetting.All.FirstOrDefault(s => s.Step(range) <= wanted * (1 + 1e-9));
        return fit?.Nplc ?? throw new ScpiException(ScpiError.DataOutOfRange);
    }

    private static string Describe(MeterSettings settings)
    {
        var active = settings.Active;
        var step = (NplcSetting.Find(active.Nplc) ?? NplcSetting.Default).Step(active.Range);
        return $"\"{SenseCommands.FunctionName(settings.Function, quoted: false)} {Nr3.Format(active.Range)},"
            + $"{Nr3.Format(step)}\"";
    }
}
