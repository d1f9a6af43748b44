namespace SortRig.Simulator.Physics;

/// <summary>
/// The scanner card: part channels 101..(100 + n) that hold parts for drift logging, and one
/// Pt100 channel whose resistance follows the ambient by the Callendar-Van Dusen equation.
/// Loading is done in-process or through the side channel; routing is done by SCPI ROUTe.
/// </summary>
public sealed class Scanner
{
    private readonly Dictionary<int, ContactSlot> _slots;
    private readonly BenchEnvironment _env;

    internal Scanner(BenchEnvironment env, int partChannelCount, int pt100Channel)
    {
        _env = env;
        _slots = Enumerable.Range(101, partChannelCount).ToDictionary(c => c, c => new ContactSlot($"Channel {c}"));
        PartChannels = [.. _slots.Keys.Order()];
        Pt100Channel = pt100Channel;
    }

    /// <summary>Channels that can hold a part, ascending (101, 102, ...).</summary>
    public IReadOnlyList<int> PartChannels { get; }

    /// <summary>The channel wired to the Pt100 (R0 = 100 ohm) sensing the room.</summary>
    public int Pt100Channel { get; }

    /// <summary>True when the number is a part channel or the Pt100 channel.</summary>
    public bool Exists(int channel) => channel == Pt100Channel || _slots.ContainsKey(channel);

    /// <summary>Loads a part into a part channel now.</summary>
    /// <param name="channel">A part channel number.</param>
    /// <param name="part">The part.</param>
    /// <param name="warmKelvin">Body temperature above ambient at loading, in K; default 0.</param>
    public void Load(int channel, SimulatedPart part, double warmKelvin = 0) =>
        Slot(channel).Insert(part, warmKelvin, _env.Now);

    /// <summary>Empties a part channel; returns the part or null.</summary>
    public SimulatedPart? Unload(int channel) => Slot(channel).Remove();

    /// <summary>The part in a part channel, or null.</summary>
    public SimulatedPart? Occupant(int channel) => Slot(channel).Occupant;

    internal InputSample Sample(int channel, DateTimeOffset t, ContactBounce bounce) =>
        channel == Pt100Channel
            ? InputSample.Of(CallendarVanDusen.Ohms(_env.AmbientAt(t)))
            : Slot(channel).Sample(t, _env, bounce);

    private ContactSlot Slot(int channel) =>
        _slots.TryGetValue(channel, out var slot)
            ? slot
            : throw new ArgumentOutOfRangeException(
                nameof(channel),
                channel,
                $"Channel {channel} is not a part channel; part channels are {PartChannels[0]}..{PartChannels[^1]}."
            );
}
