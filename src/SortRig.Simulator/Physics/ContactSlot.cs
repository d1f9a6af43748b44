namespace SortRig.Simulator.Physics;

/// <summary>One pair of contacts that can hold a part: the front fixture or a scanner channel.</summary>
internal sealed class ContactSlot
{
    private readonly Lock _gate = new();
    private readonly string _name;
    private readonly ExcessNoise? _excess;
    private readonly double _thermalResistance;
    private SimulatedPart? _part;
    private DateTimeOffset _insertedAt;
    private double _warmKelvin;

    /// <summary>A slot; the rich model passes its part excess noise and the thermal resistance for
    /// self-heating.</summary>
    public ContactSlot(string name, ExcessNoise? excess = null, double thermalResistanceKelvinPerWatt = 0)
    {
        _name = name;
        _excess = excess;
        _thermalResistance = thermalResistanceKelvinPerWatt;
    }

    public SimulatedPart? Occupant
    {
        get
        {
            lock (_gate)
            {
                return _part;
            }
        }
    }

    public DateTimeOffset? InsertedAt
    {
        get
        {
            lock (_gate)
            {
                return _part is null ? null : _insertedAt;
            }
        }
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

        _excess?.Reset(at);
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

    private (SimulatedPart? Part, DateTimeOffset InsertedAt, double Warm) Snapshot()
    {
        lock (_gate)
        {
            return (_part, _insertedAt, _warmKelvin);
        }
    }

    /// <summary>What the contacts present at time t: open, bouncing, or the part at its current temperature.</summary>
    public InputSample Sample(DateTimeOffset t, BenchEnvironment env, ContactBounce bounce)
    {
        var (part, insertedAt, warm) = Snapshot();

        if (part is null)
        {
            return InputSample.Open;
        }

        var since = t - insertedAt;
        var ohms = Clean(part, warm, since, t, env);
        if (_excess is not null)
        {
            ohms *= 1 + (_excess.Ppm(t) * 1e-6);
        }

        return bounce.IsBouncing(since)
            ? bounce.Disturb(ohms)
            : new InputSample(false, ohms, HeatingPerWatt(part, since), part.TempcoPpmPerKelvin);
    }

    /// <summary>
    /// Truth side (benchmarks): the noise-free value the part presents at time t on a range, with its cooling and
    /// self-heating but without excess noise or bounce; NaN when the slot is empty.
    /// </summary>
    public double Presented(DateTimeOffset t, BenchEnvironment env, double rangeOhms)
    {
        var (part, insertedAt, warm) = Snapshot();

        if (part is null)
        {
            return double.NaN;
        }

        var since = t - insertedAt;
        var sample = new InputSample(
            false,
            Clean(part, warm, since, t, env),
            HeatingPerWatt(part, since),
            part.TempcoPpmPerKelvin
        );
        return SelfHeating.Apply(sample, rangeOhms);
    }

    /// <summary>Truth side: the value the part in the slot settles to on a range (self-heating at its steady state), at
    /// the ambient of time t.</summary>
    public double Settled(DateTimeOffset t, BenchEnvironment env, double rangeOhms)
    {
        var part = Occupant;
        if (part is null)
        {
            return double.NaN;
        }

        var sample = new InputSample(false, env.SettledOhms(part, t), _thermalResistance, part.TempcoPpmPerKelvin);
        return SelfHeating.Apply(sample, rangeOhms);
    }

    private static double Clean(
        SimulatedPart part,
        double warm,
        TimeSpan since,
        DateTimeOffset t,
        BenchEnvironment env
    ) => part.OhmsAt(PartThermal.Celsius(part, env.AmbientAt(t), warm, since), env.HoursSinceEpoch(t));

    private double HeatingPerWatt(SimulatedPart part, TimeSpan since) =>
        _thermalResistance == 0 ? 0 : PartThermal.HeatingPerWatt(part, _thermalResistance, since);
}
