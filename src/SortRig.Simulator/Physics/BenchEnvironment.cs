namespace SortRig.Simulator.Physics;

/// <summary>The clock and the room: bench epoch, ambient temperature and ageing hours.</summary>
internal sealed class BenchEnvironment
{
    private readonly AmbientWander _wander;

    public BenchEnvironment(TimeProvider time, AmbientSpec ambient, AmbientWander? wander = null)
    {
        Time = time;
        Ambient = ambient;
        _wander = wander ?? AmbientWander.None;
        Epoch = time.GetUtcNow();
    }

    public TimeProvider Time { get; }

    public AmbientSpec Ambient { get; }

    /// <summary>Bench start; the reel's true values and drift are referred to it.</summary>
    public DateTimeOffset Epoch { get; }

    public DateTimeOffset Now => Time.GetUtcNow();

    public double AmbientAt(DateTimeOffset t) => Ambient.CelsiusAt(t - Epoch) + _wander.KelvinAt(t - Epoch);

    public double HoursSinceEpoch(DateTimeOffset t) => (t - Epoch).TotalHours;

    /// <summary>True value of a part settled at ambient at time t, in ohms.</summary>
    public double SettledOhms(SimulatedPart part, DateTimeOffset t) => part.OhmsAt(AmbientAt(t), HoursSinceEpoch(t));
}
