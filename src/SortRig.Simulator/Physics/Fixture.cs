namespace SortRig.Simulator.Physics;

/// <summary>
/// The front test fixture wired to the meter terminals. Empty reads open (overload).
/// Thread-safe; used by the virtual operator, the side channel and in-process tests.
/// </summary>
public sealed class Fixture
{
    private readonly ContactSlot _slot;
    private readonly BenchEnvironment _env;

    internal Fixture(BenchEnvironment env, PhysicsSpec? physics = null, int excessSeed = 0)
    {
        _env = env;
        _slot = physics is { IsRich: true }
            ? new ContactSlot(
                "The fixture",
                new ExcessNoise(physics, excessSeed),
                physics.ThermalResistanceKelvinPerWatt
            )
            : new ContactSlot("The fixture");
    }

    /// <summary>The part in the fixture, or null when empty.</summary>
    public SimulatedPart? Occupant => _slot.Occupant;

    /// <summary>True when a part is in the fixture.</summary>
    public bool IsOccupied => _slot.Occupant is not null;

    /// <summary>When the current part was inserted (bench clock), or null when empty.</summary>
    public DateTimeOffset? InsertedAt => _slot.InsertedAt;

    /// <summary>Puts a part in the fixture now.</summary>
    /// <param name="part">A part from <see cref="SimulatedBench.Reel"/>.</param>
    /// <param name="warmKelvin">Body temperature above ambient at insertion, in K (handling warmth); -50 to 100,
    /// default 0.</param>
    /// <exception cref="InvalidOperationException">The fixture already holds a part.</exception>
    public void Insert(SimulatedPart part, double warmKelvin = 0) => _slot.Insert(part, warmKelvin, _env.Now);

    /// <summary>Takes the part out; returns it, or null when the fixture was empty.</summary>
    public SimulatedPart? Remove() => _slot.Remove();

    internal InputSample Sample(DateTimeOffset t, ContactBounce bounce) => _slot.Sample(t, _env, bounce);

    /// <summary>Truth side (benchmarks): the noise-free value presented at t on a range (cooling, self-heating; no
    /// excess noise).</summary>
    internal double Presented(DateTimeOffset t, double rangeOhms) => _slot.Presented(t, _env, rangeOhms);

    /// <summary>Truth side (benchmarks): the value the part settles to on a range, at the ambient of time t.</summary>
    internal double Settled(DateTimeOffset t, double rangeOhms) => _slot.Settled(t, _env, rangeOhms);
}
