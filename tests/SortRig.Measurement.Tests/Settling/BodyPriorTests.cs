using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;
using MathNet.Numerics.Statistics;
using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

public sealed class BodyPriorTests
{
    /// <summary>A resolved fit of a body time constant (what the reel prior learns from).</summary>
    private static RecoveryFit Fit(double tau, double se) =>
        new(RecoveryModel.TwoExponentials, 1e4, 1e-3, 1e-4, [0.8, tau], 250, 10.5, 7e-3, 0, 1)
        {
            BodyTimeConstant = tau,
            BodyStandardError = se,
            BodyResolved = true,
        };

    [Theory]
    [InlineData(19.0)]
    [InlineData(4.0)]
    [InlineData(double.PositiveInfinity)]
    public void Penalty_IsMinusTwiceTheLogDensityRatio_OfStudentTOrNormal(double dof)
    {
        // Referee: MathNet's Student t and normal log densities: −2 (ln p(ln τ) − ln p(centre)) is the prior's
        // deviance.
        var prior = new BodyPrior(Math.Log(4), 0.12, dof);
        foreach (var tau in new[] { 2.1, 3.3, 4.0, 4.4, 5.0, 7.5 })
        {
            var u = Math.Log(tau);
            var expected = double.IsPositiveInfinity(dof)
                ? -2
                    * (
                        Normal.PDFLn(prior.LogMean, prior.LogScale, u)
                        - Normal.PDFLn(prior.LogMean, prior.LogScale, prior.LogMean)
                    )
                : -2
                    * (
                        StudentT.PDFLn(prior.LogMean, prior.LogScale, dof, u)
                        - StudentT.PDFLn(prior.LogMean, prior.LogScale, dof, prior.LogMean)
                    );
            Assert.Equal(expected, prior.Penalty(tau), 1e-9);
            // Reach inverts it: the |z| of that penalty.
            Assert.Equal(Math.Abs(u - prior.LogMean) / prior.LogScale, prior.Reach(prior.Penalty(tau)), 1e-9);
        }
    }

    [Fact]
    public void ReelPrior_Body_IsThePosteriorPredictiveOfTheResolvedEstimates()
    {
        // Referee: the posterior predictive of a normal sample under the non-informative prior is Student t with
        // n − 1 degrees of freedom, centre the sample mean, scale s √(1 + 1/n) (Gelman et al., Bayesian Data Analysis,
        // sec. 3.2, from memory); mean and sample variance of ln τ from MathNet's descriptive statistics.
        var taus = Enumerable.Range(0, 25).Select(k => 3.3 + (1.4 * ((k * 7) % 25) / 24.0)).ToArray();
        var prior = ReelPrior.Empty;
        for (var k = 0; k < taus.Length; k++)
        {
            prior = prior.Learn(Fit(taus[k], 0.05));
            if (k == ReelPrior.MinParts - 2)
            {
                Assert.Null(prior.Body);
            }
        }

        var logs = taus.Select(x => Math.Log(x)).ToArray();
        var body = prior.Body!;
        Assert.Equal(logs.Mean(), body.LogMean, 1e-12);
        Assert.Equal(Math.Sqrt(logs.Variance() * (1 + (1.0 / 25))), body.LogScale, 1e-9);
        Assert.Equal(24, body.Dof);
    }

    [Fact]
    public void PenalizedInterval_NoisyTwoPathRecord_MatchesBruteForceOverTheSameGrid()
    {
        // Referee: brute force over the same grid with MathNet's QR for each linear least-squares fit and its
        // inverse for c = ((XᵀX)⁻¹)₀₀ (Draper and Smith ch. 2, from memory): the union of Â ± √((Q_min + T − Q) c s²),
        // Q = RSS / s² + penalty, amplitudes of one sign, lead below body / 1.5, body at most 5 s.
        var noise = ReadingScript.Gaussian(5, 0.004);
        var t = Enumerable.Range(0, 110).Select(k => k * 0.041).ToArray();
        var y = t.Select(x => 0.5 + (0.3 * Math.Exp(-x / 0.8)) + (0.6 * Math.Exp(-x / 4.2)) + noise()).ToArray();
        var prior = new BodyPrior(Math.Log(4), 0.12, 19);
        var s2 = 0.004 * 0.004;

        var (low, high) = ExponentialFitter.PenalizedInterval(t, y, s2, 0.02, 5, prior, 3.841, out var q, out _, out _);

        var threshold = ExponentialFitter.Threshold(t.Length - 5);
        var reach = prior.Reach(threshold + 3.841) * prior.LogScale;
        var (lo, hi) = (Math.Max(prior.LogMean - reach, Math.Log(0.03)), Math.Min(prior.LogMean + reach, Math.Log(5)));
        var bodies = new List<double>();
        for (var u = lo; u < hi; u += 0.02)
        {
            bodies.Add(Math.Exp(u));
        }

        bodies.Add(Math.Exp(hi));
        var points = new List<(double Q, double A, double C)>();
        var yv = Vector<double>.Build.DenseOfArray(y);
        void Add(double[] taus, double body)
        {
            var x = Matrix<double>.Build.Dense(t.Length, taus.Length + 1, (i, j) =>
                j == 0 ? 1 : Math.Exp(-t[i] / taus[j - 1])
            );
            var beta = x.QR().Solve(yv);
            if (taus.Length == 2 && beta[1] * beta[2] < 0)
            {
                return;
            }

            var rss = Math.Pow((x * beta - yv).L2Norm(), 2);
            points.Add(((rss / s2) + prior.Penalty(body), beta[0], (x.TransposeThisAndMultiply(x)).Inverse()[0, 0]));
        }

        foreach (var body in bodies)
        {
            Add([body], body);
            for (var u = Math.Log(0.02); u < hi - Math.Log(1.5) && Math.Exp(u) * 1.5 <= body * (1 + 1e-9); u += 0.1)
            {
                Add([Math.Exp(u), body], body);
            }
        }

        var qMin = points.Min(p => p.Q);
        var inside = points.Where(p => p.Q <= qMin + threshold).ToList();
        var (refLow, refHigh) = (
            inside.Min(p => p.A - Math.Sqrt((qMin + threshold - p.Q) * p.C * s2)),
            inside.Max(p => p.A + Math.Sqrt((qMin + threshold - p.Q) * p.C * s2))
        );
        Assert.Equal(qMin, q, 1e-6 * qMin);
        Assert.Equal(refLow, low, 1e-7);
        Assert.Equal(refHigh, high, 1e-7);
    }

    [Fact]
    public void PenalizedInterval_NoiseFreeShortRecord_HoldsTheTruth_NarrowerThanTheRecordsOwnProfile()
    {
        // Hand-derived: the record is noise-free, so at the true time constants RSS = 0 and the penalised deviance is
        // the penalty alone, z² ≈ 1 for a body about one scale from the centre (normal prior); Q_min ≥ 0, so the truth
        // is inside the interval whenever 1 ≤ threshold (9.1 and up). Three seconds of record (under one body time
        // constant) do not resolve the body: the record's own two-path profile interval is wide, and the prior's
        // information, added to the record's (Van Trees: the Bayesian information is the data's plus the prior's),
        // narrows it (here by about a third: a prior sd of 0.1 in ln τ against a record that leaves the body free by
        // tens of per cent). Truth: A = 12.5. Both time constants are put on the interval's grids (lead 0.02 e^(0.1 k),
        // body from the grid's lowest in steps of 0.02 in ln τ, about one scale above the centre), so the exact fit is
        // among the grid's.
        var prior = new BodyPrior(Math.Log(4), 0.1, double.PositiveInfinity);
        var t = Enumerable.Range(0, 74).Select(k => k * 0.041).ToArray();
        var lowest = prior.LogMean - (prior.Reach(ExponentialFitter.Threshold(t.Length - 5) + 3.841) * prior.LogScale);
        var (a, lead) = (12.5, 0.02 * Math.Exp(3.5));
        var body = Math.Exp(lowest + (0.02 * Math.Round((prior.LogMean + 0.1 - lowest) / 0.02)));
        var y = t.Select(x => a + (0.35 * Math.Exp(-x / lead)) + (0.65 * Math.Exp(-x / body))).ToArray();
        var s2 = 0.003 * 0.003;

        var (low, high) = ExponentialFitter.PenalizedInterval(t, y, s2, 0.02, 5, prior, 3.841, out _, out _, out _);
        var free = ExponentialFitter.ProfileInterval(t, y, ExponentialFitter.Two(t, y, 0.02, 5, 0), s2, 0.02, 5);

        Assert.InRange(a, low, high);
        Assert.True(high - low < free.High - free.Low, $"{high - low} vs {free.High - free.Low}");
    }
}
