using SortRig.Simulator.Meter;

namespace SortRig.Simulator.Scpi;

/// <summary>One command or query being executed: its parameters, the device and the session.</summary>
internal sealed class ScpiCall
{
    public ScpiCall(ProgramUnit unit, DeviceContext device, ScpiSession session) =>
        (Unit, Device, Session) = (unit, device, session);

    public ProgramUnit Unit { get; }

    public DeviceContext Device { get; }

    public ScpiSession Session { get; }

    public IReadOnlyList<string> Parameters => Unit.Parameters;

    public bool Has(int index) => index < Parameters.Count;

    /// <summary>A number (NRf with optional suffix), or one of the keywords mapped to a value.</summary>
    public double Number(int index, NumericParameter spec) => ScpiParameters.Number(Parameters[index], spec);

    /// <summary>An integer count within [min, max]; MIN and MAX keywords accepted.</summary>
    public int Count(int index, int min, int max)
    {
        var value = Number(index, NumericParameter.Plain with { Min = min, Max = max });
        if (value < min || value > max)
        {
            throw new ScpiException(ScpiError.DataOutOfRange);
        }

        return (int)Math.Round(value);
    }

    /// <summary>ON|OFF|1|0 (a number counts as true when it rounds to non-zero).</summary>
    public bool Boolean(int index) => ScpiParameters.Boolean(Parameters[index]);

    /// <summary>The long form of whichever of <paramref name="mnemonics"/> the parameter matches; -224
    /// otherwise.</summary>
    public string Keyword(int index, params string[] mnemonics) => ScpiParameters.Keyword(Parameters[index], mnemonics);

    /// <summary>A channel list whose channels all exist on the scanner; -222 otherwise.</summary>
    public IReadOnlyList<int> Channels(int index)
    {
        var channels = ChannelList.Parse(Parameters[index]);
        if (channels.Any(c => !Device.Scanner.Exists(c)))
        {
            throw new ScpiException(ScpiError.DataOutOfRange);
        }

        return channels;
    }
}
