using MathNet.Numerics.Random;

namespace SortRig.Simulator.Physics;

/// <summary>
/// Parts not on the reel (kept from an earlier batch), drawn on request like reel parts from a
/// stream of their own, numbered after the reel. Thread-safe.
/// </summary>
internal sealed class LooseParts(ReelSpec spec, int firstIndex, int seed, PhysicsSpec? physics = null)
{
    private readonly Random _rng = new MersenneTwister(seed, threadSafe: false);
    private readonly List<SimulatedPart> _taken = [];
    private readonly Lock _gate = new();

    public SimulatedPart Take(double nominalOhms)
    {
        lock (_gate)
        {
            var part = ReelBuilder.Draw(spec, _rng, firstIndex + _taken.Count, nominalOhms);
            if (physics is { IsRich: true })
            {
                part = PartThermal.Enrich(part, physics, _rng);
            }

            _taken.Add(part);
            return part;
        }
    }

    /// <summary>The loose part with this index, or null.</summary>
    public SimulatedPart? Find(int index)
    {
        lock (_gate)
        {
            var i = index - firstIndex;
            return i >= 0 && i < _taken.Count ? _taken[i] : null;
        }
    }
}
