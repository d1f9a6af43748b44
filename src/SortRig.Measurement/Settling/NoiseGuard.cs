using MathNet.Numerics.Statistics;

namespace SortRig.Measurement.Settling;

/// <summary>
/// A robust estimate of the reading noise over a longer history than the window, from successive differences
/// (see <see cref="Estimate"/>). It keeps a noisy part from being accepted on one lucky window; a settling
/// transient's few large steps are outliers that the trimming drops, and a slow drift adds only its small
/// per-step change.
/// </summary>
internal sealed class NoiseGuard(int history)
{
    private static readonly double s_scale = 1.0 / (0.6744897501960817 * Math.Sqrt(2.0));
    private readonly Queue<double> _steps = new(history + 1);
    private double? _previous;

    /// <summary>Robust standard deviation of one reading, ohms; 0 with fewer than 2 steps or history 0.</summary>
    public double Sigma { get; private set; }

    public void Add(double value)
    {
        if (history == 0)
        {
            return;
        }

        if (_previous is { } previous)
        {
            _steps.Enqueue(Math.Abs(value - previous));
            if (_steps.Count > history)
            {
                _steps.Dequeue();
            }

            Sigma = _steps.Count >= 2 ? Estimate(_steps.ToArray()) : 0;
        }

        _previous = value;
    }

    /// <summary>
    /// Trimmed mean-square successive difference: σ0 = median|Δ| / (0.6745 √2) locates the noise; differences
    /// above 5 √2 σ0 (a settling step or a glitch) are dropped; σ² = Σ Δ² / (2 n) over the rest (von Neumann).
    /// </summary>
    private static double Estimate(double[] steps)
    {
        var cut = 5 * Math.Sqrt(2.0) * steps.Median() * s_scale;
        double sum = 0;
        var n = 0;
        foreach (var d in steps)
        {
            if (d <= cut)
            {
                sum += d * d;
                n++;
            }
        }

        return n > 0 ? Math.Sqrt(sum / (2.0 * n)) : 0;
    }

    public void Clear()
    {
        _steps.Clear();
        _previous = null;
        Sigma = 0;
    }
}
