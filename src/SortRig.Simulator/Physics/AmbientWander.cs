using MathNet.Numerics.Random;

namespace SortRig.Simulator.Physics;

/// <summary>
/// Rich model: slow wander of the room temperature on top of <see cref="AmbientSpec"/>: four sinusoids with
/// periods drawn log-uniformly between 5 and 60 min, random phases, amplitudes √(2/4) × the RMS so that the sum
/// has the given RMS. A deterministic function of time (any instant may be asked, in any order).
/// </summary>
internal sealed class AmbientWander
{
    private readonly (double Amplitude, double Omega, double Phase)[] _terms;

    public AmbientWander(double rmsKelvin, int seed)
    {
        var rng = new MersenneTwister(seed, threadSafe: false);
        const int Terms = 4;
        var amplitude = rmsKelvin * Math.Sqrt(2.0 / Terms);
        _terms =
        [
            .. Enumerable
                .Range(0, Terms)
                .Select(_ =>
                {
                    var period = 300 * Math.Exp(rng.NextDouble() * Math.Log(12));
                    return (amplitude, 2 * Math.PI / period, 2 * Math.PI * rng.NextDouble());
                }),
        ];
    }

    /// <summary>None: a constant zero.</summary>
    public static AmbientWander None { get; } = new(0, 0);

    /// <summary>The wander at a time since the bench epoch, K.</summary>
    public double KelvinAt(TimeSpan sinceEpoch)
    {
        var t = sinceEpoch.TotalSeconds;
        double sum = 0;
        foreach (var (a, w, phi) in _terms)
        {
            sum += a * Math.Sin((w * t) + phi);
        }

        return sum;
    }
}
