using MathNet.Numerics.Distributions;
using MathNet.Numerics.Random;

namespace SortRig.Simulator.Physics;

/// <summary>
/// Rich model: the excess noise of the part in a slot, in ppm of its value. Low-frequency (1/f-like) noise is the
/// sum of four Ornstein-Uhlenbeck processes with time constants 0.1, 1, 10 and 100 s and equal variance (a sum of
/// Lorentzians one decade apart approximates 1/f between them; common practice, no source), updated exactly over
/// the time between samples. A share of parts also shows popcorn noise: a random telegraph between −h/2 and +h/2
/// with exponential dwell times. Each insertion draws its part's popcorn and a fresh stationary state. Draws come
/// from its own seeded stream; samples must come in time order (an earlier time counts as no time passed). Thread-safe.
/// </summary>
internal sealed class ExcessNoise(PhysicsSpec physics, int seed)
{
    private static readonly double[] s_timeConstants = [.. PhysicsSpec.FlickerTimeConstants];
    private readonly Random _rng = new MersenneTwister(seed, threadSafe: false);
    private readonly Lock _gate = new();
    private readonly double[] _state = new double[s_timeConstants.Length];
    private readonly double _sigma = physics.FlickerPpm / Math.Sqrt(s_timeConstants.Length);
    private DateTimeOffset? _last;
    private bool _popcorn;
    private bool _high;
    private DateTimeOffset _nextFlip;

    /// <summary>A new part was inserted at <paramref name="at"/>.</summary>
    public void Reset(DateTimeOffset at)
    {
        lock (_gate)
        {
            for (var i = 0; i < _state.Length; i++)
            {
                _state[i] = Normal.Sample(_rng, 0, _sigma);
            }

            _popcorn = _rng.NextDouble() < physics.PopcornShare;
            _high = _rng.NextDouble() < 0.5;
            _nextFlip = at + Dwell();
            _last = at;
        }
    }

    /// <summary>The excess noise at time t, ppm of the part's value.</summary>
    public double Ppm(DateTimeOffset t)
    {
        lock (_gate)
        {
            var dt = _last is { } last && t > last ? (t - last).TotalSeconds : 0;
            if (dt > 0)
            {
                for (var i = 0; i < _state.Length; i++)
                {
                    var decay = Math.Exp(-dt / s_timeConstants[i]);
                    _state[i] =
                        (_state[i] * decay) + (_sigma * Math.Sqrt(1 - (decay * decay)) * Normal.Sample(_rng, 0, 1));
                }

                _last = t;
            }

            while (_popcorn && t >= _nextFlip)
            {
                _high = !_high;
                _nextFlip += Dwell();
            }

            var popcorn = _popcorn ? (_high ? 0.5 : -0.5) * physics.PopcornPpm : 0;
            return _state.Sum() + popcorn;
        }
    }

    private TimeSpan Dwell() => TimeSpan.FromSeconds(Exponential.Sample(_rng, 1 / physics.PopcornDwell.TotalSeconds));
}
