using SortRig.Measurement.Readings;
using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Settling;

/// <summary>
/// The residual-settling term. A part cooling after handling approaches its settled value as c·e^(−t/τ), whose
/// slope is −c·e^(−t/τ)/τ: the excess still present is |slope| × τ. With the slope b known to ±t·SE(b) and τ at
/// most the assumed τ_a, the excess of a window mean is within a = (|b| + t·SE(b)) × τ_a (t: two-sided
/// 1 − SlopeAlpha quantile of Student's t, n − 2 degrees of freedom). In span mode b comes from a least-squares
/// line over the last SettlingSpan of readings, which resolves a slow exponential far better than a short window.
/// </summary>
internal sealed class ResidualSettling(SettleOptions options, double resolutionOhms)
{
    // A quantised reading cannot pin a slope better than its resolution allows: the residual scatter used for SE(b)
    // is at least step/√12 (GUM F.2.2.1), so a run of identical readings never proves a flat line.
    private readonly double _scatterFloor = resolutionOhms / Math.Sqrt(12);
    private readonly Queue<Reading> _span = new();
    private readonly Dictionary<int, double> _criticalT = [];
    private readonly double _tau = options.AssumedTimeConstant.TotalSeconds;

    /// <summary>True when a settling span is fitted and judged (SettlingSpan &gt; 0).</summary>
    public bool SpanMode { get; } = options.SettlingSpan > TimeSpan.Zero;

    /// <summary>Keeps the finite readings of the last SettlingSpan, never fewer than <paramref
    /// name="atLeast"/>.</summary>
    public void Add(Reading reading, int atLeast)
    {
        if (!SpanMode)
        {
            return;
        }

        _span.Enqueue(reading);
        while (_span.Count > atLeast && reading.Time - _span.Peek().Time > options.SettlingSpan)
        {
            _span.Dequeue();
        }
    }

    public void Clear() => _span.Clear();

    /// <summary>Readings held in the span.</summary>
    internal int Count => _span.Count;

    /// <summary>
    /// The half-width a, ohms, for the mean of <paramref name="values"/>: from the span fit in span mode (∞ when it
    /// cannot be fitted), else from the window's own fit. A span fit's slope belongs to the span's mean time; the
    /// excess decays by e^(−Δt/τ_a) from there to the window's mean time (τ e^(−Δt/τ) grows with τ, so τ_a ≥ τ
    /// keeps the bound).
    /// </summary>
    public double HalfWidth(WindowStatistics window, double windowCriticalT, IReadOnlyList<Reading> values)
    {
        if (_tau == 0)
        {
            return 0;
        }

        if (!SpanMode)
        {
            return (Math.Abs(window.Slope) + (windowCriticalT * SlopeError(window))) * _tau;
        }

        var span = _span.ToArray();
        var t = CriticalT(span.Length);
        if (WindowStatistics.Of(span, t) is not { } fit)
        {
            return double.PositiveInfinity;
        }

        var lag = (MeanTime(values) - MeanTime(span)).TotalSeconds;
        var error = SlopeError(fit) * Math.Sqrt(SlowNoiseInflation(span, fit));
        return (Math.Abs(fit.Slope) + (t * error)) * _tau * Math.Exp(-Math.Max(0, lag) / _tau);
    }

    /// <summary>
    /// Restarts the span after a level shift (<see cref="ChangePoint"/>, at <paramref name="alpha"/> over all
    /// positions): the readings before the step are dropped, so the slope that bounds the recovery still to come is
    /// read from one level of the part only. True when readings were dropped. Nothing in window mode.
    /// </summary>
    public bool RestartAfterStep(double alpha)
    {
        if (!SpanMode || _span.Count < (2 * ChangePoint.MinSegment) + 4)
        {
            return false;
        }

        var span = _span.ToArray();
        var t = new double[span.Length];
        var y = new double[span.Length];
        for (var i = 0; i < span.Length; i++)
        {
            t[i] = (span[i].Time - span[0].Time).TotalSeconds;
            y[i] = span[i].Value - span[0].Value;
        }

        var k = ChangePoint.Locate(t, y, _scatterFloor * _scatterFloor, alpha);
        for (var i = 0; i < k; i++)
        {
            _span.Dequeue();
        }

        return k > 0;
    }

    /// <summary>
    /// The batch-means factor (≥ 1) of the span line's residuals (<see cref="PredictiveSettling.SlowNoiseInflation"/>,
    /// blocks of a quarter second and up): SE(b) of a straight line assumes white scatter, but a part's 1/f-like
    /// noise wanders over the seconds of the span and tilts the line by more than that; the slope's variance is a
    /// smooth functional of the record and grows by the same factor.
    /// </summary>
    private static double SlowNoiseInflation(Reading[] span, WindowStatistics fit)
    {
        var t0 = span[0].Time;
        var x = new double[span.Length];
        var xMean = 0.0;
        for (var i = 0; i < span.Length; i++)
        {
            x[i] = (span[i].Time - t0).TotalSeconds;
            xMean += x[i];
        }

        xMean /= span.Length;
        var residuals = new double[span.Length];
        for (var i = 0; i < span.Length; i++)
        {
            residuals[i] = span[i].Value - fit.Mean - (fit.Slope * (x[i] - xMean));
        }

        return Math.Max(1, PredictiveSettling.SlowNoiseInflation(residuals, x[^1], 2));
    }

    private double SlopeError(WindowStatistics fit) =>
        Math.Max(fit.SlopeStandardError, _scatterFloor / Math.Sqrt(fit.Sxx));

    /// <summary>Adds a rectangular component of half-width a to both standard uncertainties (GUM 4.3.7,
    /// 5.1.2).</summary>
    public static MeasuredValue Widen(MeasuredValue value, double halfWidth)
    {
        if (!(halfWidth > 0))
        {
            return value;
        }

        var u = TypeB.Rectangular(halfWidth);
        return value with
        {
            StandardUncertainty = Math.Sqrt((value.StandardUncertainty * value.StandardUncertainty) + (u * u)),
            TransferUncertainty = Math.Sqrt((value.TransferUncertainty * value.TransferUncertainty) + (u * u)),
        };
    }

    private static DateTimeOffset MeanTime(IReadOnlyList<Reading> readings)
    {
        var t0 = readings[0].Time;
        double sum = 0;
        foreach (var r in readings)
        {
            sum += (r.Time - t0).TotalSeconds;
        }

        return t0 + TimeSpan.FromSeconds(sum / readings.Count);
    }

    private double CriticalT(int n)
    {
        if (n < 3)
        {
            return double.PositiveInfinity;
        }

        if (!_criticalT.TryGetValue(n, out var t))
        {
            _criticalT[n] = t = WindowStatistics.CriticalT(n, options.SlopeAlpha);
        }

        return t;
    }
}
