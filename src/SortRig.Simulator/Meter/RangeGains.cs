using MathNet.Numerics.Distributions;
using MathNet.Numerics.Random;

namespace SortRig.Simulator.Meter;

/// <summary>
/// The gain error of each resistance range: a reading on range r is (R + R_lead)(1 + g_r) before noise
/// and quantisation. Each g_r is drawn once, uniform in ±half-width, from its own seeded stream (so the
/// reel, the noise and every other stream are unchanged). Ranges share nothing: a ratio of two values
/// read on two ranges is off by about g_high − g_low, which one part read on both ranges reveals.
/// </summary>
internal sealed class RangeGains
{
    private readonly Dictionary<double, double> _errors = [];
    private readonly Lock _gate = new();
    private double _stepPpm;
    private long _stepAfter;
    private long _conversions;
    private bool _stepArmed;

    public RangeGains(double halfWidthPpm, int seed)
    {
        var rng = new MersenneTwister(seed, threadSafe: false);
        foreach (var range in ResistanceRanges.All)
        {
            // One draw per range in range order, whatever the half-width, so a seed keeps its meter.
            var u = ContinuousUniform.Sample(rng, -1, 1);
            _errors[range] = u * halfWidthPpm;
        }
    }

    /// <summary>Gain error of the range, ppm of reading; 0 for a range the meter does not have.</summary>
    public double ErrorPpm(double range) => _errors.TryGetValue(range, out var ppm) ? ppm : 0;

    /// <summary>
    /// The factor (1 + g_r)(1 + step) a reading on the range is multiplied by; each call is one conversion and counts
    /// toward an armed gain step.
    /// </summary>
    public double Factor(double range)
    {
        double step;
        lock (_gate)
        {
            _conversions++;
            step = _stepArmed && _conversions > _stepAfter ? _stepPpm : 0;
        }

        return (1 + (ErrorPpm(range) * 1e-6)) * (1 + (step * 1e-6));
    }

    /// <summary>
    /// Gain-step fault: after <paramref name="afterConversions"/> more conversions every range reads
    /// <paramref name="ppm"/> ppm higher (a meter that shifted). 0 ppm clears it.
    /// </summary>
    public void StepGain(double ppm, long afterConversions)
    {
        lock (_gate)
        {
            _stepPpm = ppm;
            _stepAfter = _conversions + afterConversions;
            _stepArmed = ppm != 0;
        }
    }

    /// <summary>The gain step in force now, ppm (0 before it fires or when none is armed).</summary>
    public double StepPpm
    {
        get
        {
            lock (_gate)
            {
                return _stepArmed && _conversions > _stepAfter ? _stepPpm : 0;
            }
        }
    }
}
