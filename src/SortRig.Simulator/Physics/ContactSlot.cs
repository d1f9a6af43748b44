namespace SortRig.Simulator.Physics;

/// <summary>One pair of contacts that can hold a part: the front fixture or a scanner channel.</summary>
internal sealed class ContactSlot
{
    private readonly Lock _gate = new();
    private readonly string _name;
    private SimulatedPart? _part;
    private DateTimeOffset _insertedAt;
    private double _warmKelvin;

    public ContactSlot(string name) => _name = name;

    public SimulatedPart? Occupant
    {
        get { lock (_gate) { return _part; } }
    }

    public DateTimeOffset? InsertedAt
    {
        get { lock (_gate) { return _part is null ? null : _insertedAt; } }
    }

    public void Insert(SimulatedPart part, double warmKelvin, DateTimeOffset at)
    {
        ArgumentNullException.ThrowIfNull(part);
        OptionGuard.InRange(warmKelvin, -50, 100, "warmKelvin", "K");
        lock (_gate)
        {
            if (_part is not null)
            {
                throw new InvalidOperationException($"{_name} already holds part {_part.Index}; remove it first.");
            }

            (_part, _insertedAt, _warmKelvin) = (part, at, warmKelvin);
        }
    }

    public SimulatedPart? Remove()
    {
        lock (_gate)
        {
            var part = _part;
            _part = null;
            return part;
        }
    }

    /// <summary>What the contacts present at time t: open, bouncing, or the part at its current temperature.</summary>
    public InputSample Sample(DateTimeOffset t, BenchEnvironment env, ContactBounce bounce)
    {
        SimulatedPart? part;
        DateTimeOffset insertedAt;
        double warm;
        lock (_gate)
        {
            (part, insertedAt, warm) = (_part, _insertedAt, _warmKelvin);
        }

        if (part is null)
        {
            return InputSample.Open;
        }

        var since = t - insertedAt;
        var celsius = PartThermal.Celsius(env.AmbientAt(t), warm, since, part.ThermalTimeConstant);
        var ohms = part.OhmsAt(celsius, env.HoursSinceEpoch(t));
        return bounce.IsBouncing(since) ? bounce.Disturb(ohms) : InputSample.Of(ohms);
    }
}
