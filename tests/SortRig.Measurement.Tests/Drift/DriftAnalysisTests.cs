using SortRig.Measurement.Drift;

namespace SortRig.Measurement.Tests.Drift;

public sealed class DriftAnalysisTests
{
    private static readonly DateTimeOffset s_start = new(2025, 3, 1, 18, 0, 0, TimeSpan.Zero);

    [Fact]
    public void Drift_HandDataSet_MatchesClosedFormLeastSquares()
    {
        // Worked by hand (normal equations): x = 0..4 h, y = 1,3,2,5,4 ppm; Sxx = 10, Sxy = 8,
        // slope = 0.8 ppm/h, intercept = 1.4 ppm, SSE = 3.6, s^2 = 3.6/3 = 1.2, SE(slope) = sqrt(1.2/10).
        double[] ppm = [1, 3, 2, 5, 4];
        DriftSample[] samples = ppm.Select(
                (p, i) => new DriftSample(s_start.AddHours(i), 100.0 * (1 + (p * 1e-6)), null)
            )
            .ToArray();

        DriftFit fit = DriftAnalysis.Drift(samples, referenceOhms: 100.0);

        Assert.Equal(0.8, fit.PpmPerHour.Value, 8);
        Assert.Equal(Math.Sqrt(0.12), fit.PpmPerHour.StandardError, 8);
        Assert.Equal(1.4, fit.InterceptPpm, 8);
        Assert.Equal(Math.Sqrt(1.2), fit.ResidualStdDevPpm, 8);
        Assert.Equal(4.0, fit.SpanHours, 12);
        Assert.Equal(s_start, fit.Origin);
    }

    [Fact]
    public void Joint_SmallDataSet_MatchesNormalEquationsSolvedByCramersRule()
    {
        double[] hours = [0, 1, 2, 3, 4, 5];
        double[] temps = [22, 24, 21, 25, 23, 20];
        double[] ppm = [0.3, 5.1, 1.2, 9.4, 6.0, 2.2];
        DriftSample[] samples = hours
            .Select((h, i) => new DriftSample(s_start.AddHours(h), 1000.0 * (1 + (ppm[i] * 1e-6)), temps[i]))
            .ToArray();

        DriftTempcoFit fit = DriftAnalysis.Joint(samples, referenceOhms: 1000.0);

        double meanT = temps.Average();
        double[][] x = hours.Select((h, i) => new[] { 1.0, h, temps[i] - meanT }).ToArray();
        (double[] beta, double[] se) = ClosedForm3(x, ppm);
        Assert.Equal(beta[0], fit.InterceptPpm, 6);
        Assert.Equal(beta[1], fit.PpmPerHour.Value, 6);
        Assert.Equal(beta[2], fit.PpmPerKelvin.Value, 6);
        Assert.Equal(se[1], fit.PpmPerHour.StandardError, 6);
        Assert.Equal(se[2], fit.PpmPerKelvin.StandardError, 6);
        Assert.Equal(meanT, fit.ReferenceTemperatureC, 12);
    }

    [Fact]
    public void Joint_SyntheticNight_RecoversKnownDriftAndTempco()
    {
        // Invented scenario: 12 h overnight log, 1 sample/min, true drift +0.5 ppm/h, tempco -3 ppm/K,
        // room temperature cycling 21..23 degC every 3 h, 0.2 ppm white noise.
        var normal = new MathNet.Numerics.Distributions.Normal(0, 0.2, new Random(3));
        DriftSample[] samples = Enumerable
            .Range(0, 720)
            .Select(i =>
            {
                double h = i / 60.0;
                double t = 22 + Math.Sin(2 * Math.PI * h / 3);
                double ppm = (0.5 * h) + (-3 * (t - 22)) + normal.Sample();
                return new DriftSample(s_start.AddMinutes(i), 10_000 * (1 + (ppm * 1e-6)), t);
            })
            .ToArray();

        DriftTempcoFit fit = DriftAnalysis.Joint(samples, referenceOhms: 10_000);

        Assert.InRange(
            fit.PpmPerHour.Value,
            0.5 - (4 * fit.PpmPerHour.StandardError),
            0.5 + (4 * fit.PpmPerHour.StandardError)
        );
        Assert.InRange(
            fit.PpmPerKelvin.Value,
            -3 - (4 * fit.PpmPerKelvin.StandardError),
            -3 + (4 * fit.PpmPerKelvin.StandardError)
        );
        Assert.InRange(fit.PpmPerHour.StandardError, 0.001, 0.01);
        Assert.InRange(fit.ResidualStdDevPpm, 0.18, 0.22);
    }

    [Fact]
    public void DriftAndTempco_Alone_RecoverSlopesOfSingleCauseData()
    {
        var normal = new MathNet.Numerics.Distributions.Normal(0, 0.1, new Random(5));
        DriftSample[] drifting = Enumerable
            .Range(0, 200)
            .Select(i => new DriftSample(
                s_start.AddMinutes(5 * i),
                100 * (1 + (((-1.2 * i / 12.0) + normal.Sample()) * 1e-6)),
                23.0
            ))
            .ToArray();
        DriftSample[] warming = Enumerable
            .Range(0, 200)
            .Select(i => new DriftSample(
                s_start.AddMinutes(5 * i),
                100 * (1 + (((15 * (20 + (i * 0.05) - 25)) + normal.Sample()) * 1e-6)),
                20 + (i * 0.05)
            ))
            .ToArray();

        DriftFit drift = DriftAnalysis.Drift(drifting, 100);
        TempcoFit tempco = DriftAnalysis.Tempco(warming, 100);

        Assert.Equal(-1.2, drift.PpmPerHour.Value, 1);
        Assert.InRange(Math.Abs(drift.PpmPerHour.Value + 1.2), 0, 4 * drift.PpmPerHour.StandardError);
        Assert.InRange(Math.Abs(tempco.PpmPerKelvin.Value - 15), 0, 4 * tempco.PpmPerKelvin.StandardError);
        Assert.Equal(199 * 0.05, tempco.TemperatureSpanK, 9);
    }

    [Fact]
    public void Joint_TemperatureFollowingTime_ThrowsCollinear()
    {
        DriftSample[] samples = Enumerable
            .Range(0, 10)
            .Select(i => new DriftSample(s_start.AddHours(i), 100 + (i * 1e-4), 20 + i))
            .ToArray();
        var ex = Assert.Throws<ArgumentException>(() => DriftAnalysis.Joint(samples));
        Assert.Contains("collinear", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void TryJoint_TemperatureFollowingTime_NoFitAndTheReasonWithoutTheParameterSuffix()
    {
        DriftSample[] samples = Enumerable
            .Range(0, 10)
            .Select(i => new DriftSample(s_start.AddHours(i), 100 + (i * 1e-4), 20 + i))
            .ToArray();
        var fit = DriftAnalysis.TryJoint(samples, null, out var reason);
        Assert.Null(fit);
        Assert.Contains("collinear", reason, StringComparison.Ordinal);
        Assert.DoesNotContain("(Parameter", reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Drift_BadSample_ThrowsNamingIndexAndField()
    {
        DriftSample[] samples =
        [
            new(s_start, 100, null),
            new(s_start.AddHours(1), double.NaN, null),
            new(s_start.AddHours(2), 100, null),
        ];
        var ex = Assert.Throws<ArgumentException>(() => DriftAnalysis.Drift(samples));
        Assert.Contains("samples[1].Ohms", ex.Message, StringComparison.Ordinal);
        var few = Assert.Throws<ArgumentException>(() => DriftAnalysis.Drift(samples[..2]));
        Assert.Contains("At least 3", few.Message, StringComparison.Ordinal);
        var noTemp = Assert.Throws<ArgumentException>(() =>
            DriftAnalysis.Tempco([new(s_start, 100, 20), new(s_start, 100, null), new(s_start, 100, 21)])
        );
        Assert.Contains("samples[1].TemperatureC", noTemp.Message, StringComparison.Ordinal);
    }

    /// <summary>Reference: solves (X^T X) b = X^T y for 3 unknowns by Cramer's rule; SE from s^2 (X^T X)^-1 via
    /// cofactors.</summary>
    private static (double[] Beta, double[] Se) ClosedForm3(double[][] x, double[] y)
    {
        var a = new double[3, 3];
        var v = new double[3];
        for (int r = 0; r < x.Length; r++)
        {
            for (int i = 0; i < 3; i++)
            {
                v[i] += x[r][i] * y[r];
                for (int j = 0; j < 3; j++)
                {
                    a[i, j] += x[r][i] * x[r][j];
                }
            }
        }

        double det = Det(a);
        var beta = new double[3];
        for (int k = 0; k < 3; k++)
        {
            var ak = (double[,])a.Clone();
            for (int i = 0; i < 3; i++)
            {
                ak[i, k] = v[i];
            }

            beta[k] = Det(ak) / det;
        }

        double sse = x.Select((row, r) => y[r] - ((row[0] * beta[0]) + (row[1] * beta[1]) + (row[2] * beta[2])))
            .Sum(e => e * e);
        double s2 = sse / (x.Length - 3);
        double[] diagInverse =
        [
            ((a[1, 1] * a[2, 2]) - (a[1, 2] * a[2, 1])) / det,
            ((a[0, 0] * a[2, 2]) - (a[0, 2] * a[2, 0])) / det,
            ((a[0, 0] * a[1, 1]) - (a[0, 1] * a[1, 0])) / det,
        ];
        return (beta, diagInverse.Select(d => Math.Sqrt(s2 * d)).ToArray());
    }

    private static double Det(double[,] m) =>
        (m[0, 0] * ((m[1, 1] * m[2, 2]) - (m[1, 2] * m[2, 1])))
        - (m[0, 1] * ((m[1, 0] * m[2, 2]) - (m[1, 2] * m[2, 0])))
        + (m[0, 2] * ((m[1, 0] * m[2, 1]) - (m[1, 1] * m[2, 0])));
}
