using SortRig.Simulator.Meter;
using static SortRig.Simulator.Scpi.CommonCommands;

namespace SortRig.Simulator.Scpi;

/// <summary>
/// SIMulation: vendor-specific subsystem for tests only (never used by product logic): the
/// fixture, the reel's hidden truth, the ranges' gain errors, the operator, the scanner's loading, the room and the
/// clock.
/// </summary>
internal static class SimulationCommands
{
    private static readonly NumericParameter s_kelvin = NumericParameter.Unitless(0, 30, 0);

    public static void Register(CommandTable table)
    {
        table
            .Add("SIMulation:FIXTure:INSert", (c, _) => Done(() => Insert(c)), 0, 2)
            .Add("SIMulation:FIXTure:REMove", (c, _) => Done(() => c.Device.Fixture.Remove()))
            .Add("SIMulation:FIXTure:STATe?", (c, _) => Reply(Nr3.Format(c.Device.Fixture.IsOccupied)))
            .Add("SIMulation:PART:INDex?", (c, _) => Reply(Nr3.Format(c.Device.Fixture.Occupant?.Index ?? -1)))
            .Add("SIMulation:PART:TRUE?", (c, _) => Reply(Nr3.Format(Truth(c))), 1, 1)
            .Add(
                "SIMulation:GAIN?",
                (c, _) =>
                    Reply(
                        Nr3.Format(c.Device.Engine.Gains.ErrorPpm(c.Number(0, NumericParameter.Ohms(null, null, null))))
                    ),
                1,
                1
            )
            .Add("SIMulation:GAIN:STEP", (c, _) => Done(() => StepGain(c)), 1, 2)
            .Add("SIMulation:GAIN:STEP?", (c, _) => Reply(Nr3.Format(c.Device.Engine.Gains.StepPpm)))
            .Add("SIMulation:REEL:COUNt?", (c, _) => Reply(Nr3.Format(c.Device.Reel.Count)))
            .Add("SIMulation:OPERator:ANNounce", (c, _) => Done(() => c.Device.Operator.OnPartAnnounced()))
            .Add(
                "SIMulation:OPERator:SKIP",
                (c, _) => Done(() => c.Device.Operator.SkipTo(c.Count(0, 0, c.Device.Reel.Count))),
                1,
                1
            )
            .Add("SIMulation:OPERator:NEXT?", (c, _) => Reply(Nr3.Format(c.Device.Operator.NextIndex)))
            .Add("SIMulation:OPERator:STATe?", (c, _) => Reply(c.Device.Operator.State.ToString().ToUpperInvariant()))
            .Add("SIMulation:SCANner:LOAD", (c, _) => Done(() => Load(c)), 2, 3)
            .Add("SIMulation:SCANner:UNLoad", (c, _) => Done(() => c.Device.Scanner.Unload(PartChannel(c))), 1, 1)
            .Add("SIMulation:AMBient?", (c, _) =>
                Reply(Nr3.Format(c.Device.Environment.AmbientAt(c.Device.Environment.Now)))
            )
            .Add("SIMulation:TIME?", (c, _) =>
                Reply(Nr3.Format((c.Device.Environment.Now - c.Device.Environment.Epoch).TotalSeconds))
            );
        FaultCommands.Register(table);
    }

    /// <summary>GAIN:STEP &lt;ppm&gt;[,&lt;after conversions&gt;]: every range reads ppm higher from then on.</summary>
    private static void StepGain(ScpiCall call)
    {
        var ppm = call.Number(0, NumericParameter.Unitless(-10_000, 10_000, 0));
        var after = call.Has(1) ? call.Count(1, 0, int.MaxValue) : 0;
        call.Device.Engine.Gains.StepGain(ppm, after);
    }

    /// <summary>INSert [&lt;reel index&gt;[,&lt;warm K&gt;]]: without an index, the operator's next part (manual
    /// step).</summary>
    private static void Insert(ScpiCall call)
    {
        var device = call.Device;
        var warm = call.Has(1) ? call.Number(1, s_kelvin) : 0.0;
        OutOfRangeUnless(warm is >= 0 and <= 30);
        if (device.Fixture.IsOccupied)
        {
            throw new ScpiException(ScpiError.SettingsConflict);
        }

        if (!call.Has(0))
        {
            var inserted = Guard(() => device.Operator.InsertNext(warm));
            OutOfRangeUnless(inserted is not null);
            return;
        }

        device.Fixture.Insert(device.Reel[ReelIndex(call, 0)], warm);
    }

    private static void Load(ScpiCall call)
    {
        var channel = PartChannel(call);
        var part = call.Device.Reel[ReelIndex(call, 1)];
        var warm = call.Has(2) ? call.Number(2, s_kelvin) : 0.0;
        OutOfRangeUnless(warm is >= 0 and <= 30);
        if (call.Device.Scanner.Occupant(channel) is not null)
        {
            throw new ScpiException(ScpiError.SettingsConflict);
        }

        call.Device.Scanner.Load(channel, part, warm);
    }

    private static double Truth(ScpiCall call)
    {
        var env = call.Device.Environment;
        return env.SettledOhms(call.Device.Reel[ReelIndex(call, 0)], env.Now);
    }

    private static int ReelIndex(ScpiCall call, int parameter) => call.Count(parameter, 0, call.Device.Reel.Count - 1);

    private static int PartChannel(ScpiCall call)
    {
        var channel = call.Count(0, 0, 9999);
        OutOfRangeUnless(call.Device.Scanner.PartChannels.Contains(channel));
        return channel;
    }

    private static T Guard<T>(Func<T> action)
    {
        try
        {
            return action();
        }
        catch (InvalidOperationException)
        {
            throw new ScpiException(ScpiError.SettingsConflict);
        }
    }

    internal static void OutOfRangeUnless(bool condition)
    {
        if (!condition)
        {
            throw new ScpiException(ScpiError.DataOutOfRange);
        }
    }
}
