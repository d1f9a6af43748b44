using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Optimization;

namespace SortRig.Planning.Cups;

/// <summary>
/// A parametric model of a reel's deviations (log ppm) for the first parts, before a kernel estimate can be trusted:
/// a normal N(μ, σ) restricted to the stock tolerance [lo, hi], optionally with a hole g ≤ |x| around the nominal
/// (a lot whose tighter grades were binned out of the centre, common practice of the trade, no source). μ and σ by
/// maximum a posteriori (MathNet's Nelder–Mead on μ, ln σ), the prior worth a few parts of a lot centred on its
/// nominal; the hole's edge by its maximum-likelihood value, the
/// smallest |x| seen (the likelihood grows with g up to there). The hole is kept only when a likelihood-ratio test
/// at the 0.1 % level says so (an endpoint parameter: the gain is ≈ Exp(1) without a hole, not χ², so an information
/// criterion such as BIC would keep a hole in a plain normal reel half the time at n = 4). The edge is uncertain by
/// about one spacing of the parts at it, so the distribution function averages over its posterior (flat prior on g:
/// the likelihood Z(g)^−n falls as g moves below the smallest |x|, ≈ exponential with rate n × the density at the
/// edge), on eight equal-probability points.
/// </summary>
internal sealed class ReelModel
{
    // Equal-probability points of the edge's posterior: enough for a smooth average of eight shifted models (no
    // source).
    private const int EdgePoints = 8;

    // The log-likelihood gain of a hole at the smallest |x| under the plain fit's μ, σ is −n ln(1 − P(|X| < g));
    // without a hole n·P(|X| < smallest |x|) is the smallest of n uniforms times n, ≈ Exp(1), so a gain over ln 1000
    // keeps the hole at the 0.1 % level. The planner tests again at every plan (about 60 per reel); consecutive tests
    // share almost all their parts, so the full Bonferroni factor (1/60) would be too strict and a tenth of the usual
    // 1 % was chosen by measurement on 65 reels (docs/planning.md: 1 % and 0.32 % lost sets on plain reels, 0.01 %
    // gave up 0.6–0.8 set of the gain on binned-out ones at K = 8).
    private const double HoleTest = 6.907755278982137; // ln 1000

    private readonly double _lo;
    private readonly double _hi;
    private readonly double[] _holes;

    private ReelModel(double lo, double hi, double mu, double sigma, double[] holes)
    {
        (_lo, _hi, Mu, Sigma, _holes) = (lo, hi, mu, sigma, holes);
    }

    /// <summary>Centre of the normal, log ppm.</summary>
    public double Mu { get; }

    /// <summary>Spread of the normal, log ppm.</summary>
    public double Sigma { get; }

    /// <summary>The hole's half-width, log ppm (mean over its posterior); 0 when the test kept no hole.</summary>
    public double Hole => _holes.Average();

    /// <summary>Fits the model to the parts' centres (log ppm), all within [lo, hi]; at least one part.</summary>
    /// <param name="x">Centres, log ppm.</param>
    /// <param name="lo">Low end of the stock tolerance, log ppm.</param>
    /// <param name="hi">High end, log ppm.</param>
    /// <param name="prior">The prior on μ, σ: <c>Weight</c> pseudo-parts of N(0, <c>Sigma</c>).</param>
    public static ReelModel Fit(IReadOnlyList<double> x, double lo, double hi, (double Sigma, double Weight) prior)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(x.Count, 1);
        var n = x.Count;
        var edge = x.Min(Math.Abs);
        var (mu0, s0) = Start(x, lo, hi);
        var plain = Maximise(x, lo, hi, 0, mu0, s0, prior);
        var gain = -n * Math.Log(Mass(lo, hi, plain.Mu, plain.Sigma, edge) / Mass(lo, hi, plain.Mu, plain.Sigma, 0));
        if (!(gain > HoleTest))
        {
            return new ReelModel(lo, hi, plain.Mu, plain.Sigma, [0]);
        }

        var holed = Maximise(x, lo, hi, edge, mu0, s0, prior);

        // Density of the model at the edge (both sides), per log ppm: the rate of the edge's posterior below it.
        var z = Mass(lo, hi, holed.Mu, holed.Sigma, edge);
        var rho = (Normal.PDF(holed.Mu, holed.Sigma, edge) + Normal.PDF(holed.Mu, holed.Sigma, -edge)) / z;
        var holes = Enumerable
            .Range(0, EdgePoints)
            .Select(j => Math.Max(0, edge + (Math.Log(1 - ((j + 0.5) / EdgePoints)) / (n * rho))))
            .ToArray();
        return new ReelModel(lo, hi, holed.Mu, holed.Sigma, holes);
    }

    /// <summary>P(X ≤ y) under the model (averaged over the hole edge's posterior).</summary>
    public double Cdf(double y)
    {
        var sum = 0.0;
        foreach (var g in _holes)
        {
            sum += Below(_lo, _hi, Mu, Sigma, g, y) / Mass(_lo, _hi, Mu, Sigma, g);
        }

        return sum / _holes.Length;
    }

    /// <summary>Log-likelihood of centres under N(μ, σ) restricted to lo ≤ x ≤ hi, |x| ≥ g.</summary>
    internal static double LogLikelihood(IReadOnlyList<double> x, double lo, double hi, double g, double mu, double s)
    {
        var z = Mass(lo, hi, mu, s, g);
        if (z <= 1e-300 || x.Any(v => Math.Abs(v) < g))
        {
            return double.NegativeInfinity;
        }

        return x.Sum(v => Normal.PDFLn(mu, s, v)) - (x.Count * Math.Log(z));
    }

    private static (double Mu, double Sigma, double LogLik) Maximise(
        IReadOnlyList<double> x,
        double lo,
        double hi,
        double g,
        double mu0,
        double s0,
        (double Sigma, double Weight) prior
    )
    {
        // The prior on μ, σ: the expected log-density of Weight pseudo-parts from N(0, prior σ), untruncated.
        double Prior(double mu, double s) =>
            prior.Weight * (-Math.Log(s) - (((prior.Sigma * prior.Sigma) + (mu * mu)) / (2 * s * s)));
        double Objective(Vector<double> p)
        {
            var s = Math.Exp(p[1]);
            var l = LogLikelihood(x, lo, hi, g, p[0], s) + Prior(p[0], s);
            return double.IsFinite(l) ? -l : 1e300;
        }

        var start = Vector<double>.Build.Dense([mu0, Math.Log(s0)]);
        var step = Vector<double>.Build.Dense([s0 / 2, 0.5]);
        try
        {
            var r = NelderMeadSimplex.Minimum(ObjectiveFunction.Value(Objective), start, step, 1e-9, 2000);
            var p = r.MinimizingPoint;
            return (p[0], Math.Exp(p[1]), -r.FunctionInfoAtMinimum.Value);
        }
        catch (MaximumIterationsException)
        {
            return (mu0, s0, LogLikelihood(x, lo, hi, g, mu0, s0) + Prior(mu0, s0));
        }
    }

    // Sample mean and standard deviation, the spread floored at a thousandth of the tolerance so that a few equal
    // parts do not start the search at a degenerate point.
    private static (double Mu, double Sigma) Start(IReadOnlyList<double> x, double lo, double hi)
    {
        var mean = x.Average();
        var sd = Math.Sqrt(x.Sum(v => (v - mean) * (v - mean)) / Math.Max(1, x.Count - 1));
        return (mean, Math.Max(sd, (hi - lo) * 1e-3));
    }

    // P(lo ≤ X ≤ hi, |X| ≥ g) for X ~ N(μ, σ).
    private static double Mass(double lo, double hi, double mu, double s, double g) =>
        Below(lo, hi, mu, s, g, double.PositiveInfinity);

    // P(lo ≤ X ≤ min(y, hi), |X| ≥ g).
    private static double Below(double lo, double hi, double mu, double s, double g, double y)
    {
        double Part(double a, double b) => b > a ? Normal.CDF(mu, s, b) - Normal.CDF(mu, s, a) : 0;
        var top = Math.Min(y, hi);
        return Part(lo, Math.Min(top, -g)) + Part(Math.Max(lo, g), top);
    }
}
