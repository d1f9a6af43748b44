using MathNet.Numerics.Random;

namespace SortRig.Simulator.Physics;

/// <summary>
/// Contact bounce right after insertion: for <see cref="Duration"/> each reading sees either an open
/// contact or a wild value between 0.3x and 3x the true one (log-uniform), at random.
/// Draws from its own seeded stream so that bounce never shifts the noise sequence.
/// </summary>
internal sealed class ContactBounce
{
    private readonly Random _rng;
    private readonly Lock _gate = new();

    public ContactBounce(TimeSpan duration, int seed)
    {
        Duration = duration;
        _rng = new MersenneTwister(seed, threadSafe: false);
    }

    public TimeSpan Duration { get; }

    public bool IsBouncing(TimeSpan sinceInsertion) => sinceInsertion < Duration;

    public InputSample Disturb(double trueOhms)
    {
        lock (_gate)
        {
            if (_rng.NextDouble() < 0.5)
            {
                return InputSample.Open;
            }

            var factor = Math.Exp(Math.Log(0.3) + (_rng.NextDouble() * (Math.Log(3) - Math.Log(0.3))));
            return InputSample.Of(trueOhms * factor);
        }
    }
}
