using MathNet.Numerics.Distributions;
using MathNet.Numerics.Random;

namespace SortRig.Simulator.Physics;

/// <summary>
/// Standard normal draws for reading noise: exactly one draw per reading, from its own seeded
/// stream, so that a seed gives the same noise sequence per reading count.
/// </summary>
internal sealed class NoiseSource
{
    private readonly Random _rng;
    private readonly Lock _gate = new();

    public NoiseSource(int seed) => _rng = new MersenneTwister(seed, threadSafe: false);

    public double NextStandardNormal()
    {
        lock (_gate)
        {
            return Normal.Sample(_rng, 0, 1);
        }
    }
}
