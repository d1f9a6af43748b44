using SortRig.Measurement.Drift;

namespace SortRig.Measurement.Tests.Drift;

public sealed class AllanDeviationTests
{
    // NIST SP 1065 (2008) sec. 12 (page number not kept; section from memory), 1000-point test suite, overlapping Allan
    // deviation at tau = 1, 10, 100 (values also quoted beside the same recipe in public stability-analysis test code).
    [Theory]
    [InlineData(1, 2.922319e-01, 999)]
    [InlineData(10, 9.159953e-02, 981)]
    [InlineData(100, 3.241343e-02, 801)]
    public void Overlapping_NistTestSuite_MatchesPublishedValue(int m, double published, int terms)
    {
        AllanPoint point = AllanDeviation.Overlapping(NistTestData.Generate(), 1.0, [m]).Single();

        Assert.InRange(point.Deviation / published, 1 - 2e-6, 1 + 2e-6);
        Assert.Equal(terms, point.TermCount); // M - 2m + 1 (SP 1065 overlapping ADEV definition)
        Assert.Equal(m, point.TauSeconds);
    }

    [Fact]
    public void NistTestData_FirstPointIsTheSeed()
    {
        double[] y = NistTestData.Generate();
        Assert.Equal(1234567890 / 2147483647.0, y[0]);
        Assert.Equal((16807L * 1234567890 % 2147483647) / 2147483647.0, y[1]);
    }

    [Fact]
    public void Overlapping_EqualsBruteForceDefinition()
    {
        var random = new Random(7);
        double[] y = Enumerable.Range(0, 300).Select(_ => random.NextDouble() - 0.5).ToArray();
        IReadOnlyList<AllanPoint> points = AllanDeviation.Overlapping(y, 2.5, [1, 3, 16, 150]);

        foreach (AllanPoint p in points)
        {
            Assert.Equal(BruteForce(y, p.AveragingFactor), p.Deviation, 12);
            Assert.Equal(2.5 * p.AveragingFactor, p.TauSeconds, 12);
        }
    }

    [Fact]
    public void Overlapping_WhiteNoise_FallsAsInverseRootTau()
    {
        // White frequency noise: sigma_y(tau) = sigma / sqrt(m) (SP 1065 sec. 5.2, power-law slope -1/2).
        var normal = new MathNet.Numerics.Distributions.Normal(0, 1e-6, new Random(11));
        double[] y = Enumerable.Range(0, 8192).Select(_ => normal.Sample()).ToArray();
        IReadOnlyList<AllanPoint> points = AllanDeviation.Overlapping(y, 1.0, [1, 16]);

        Assert.InRange(points[0].Deviation, 0.97e-6, 1.03e-6);
        Assert.InRange(points[1].Deviation * 4, 0.85e-6, 1.15e-6);
        Assert.All(points, p => Assert.True(p.Lower < p.Deviation && p.Deviation < p.Upper));
    }

    [Theory]
    [InlineData(1)]
    [InlineData(4)]
    [InlineData(12)]
    public void WhiteFrequencyEdf_AgreesWithMonteCarloSpreadOfTheEstimate(int m)
    {
        // edf = 2 var^2 / Var(var estimate) (chi-square property); measured on 3000 runs of 100 Gaussian values.
        const int Runs = 3000;
        const int Count = 100;
        var normal = new MathNet.Numerics.Distributions.Normal(0, 1, new Random(100 + m));
        double trueVariance = 1.0 / m; // white FM: sigma_y^2(m) = sigma^2 / m
        double[] estimates = new double[Runs];
        for (int r = 0; r < Runs; r++)
        {
            double[] y = Enumerable.Range(0, Count).Select(_ => normal.Sample()).ToArray();
            double dev = AllanDeviation.Overlapping(y, 1.0, [m]).Single().Deviation;
            estimates[r] = dev * dev;
        }

        double mcEdf = 2 * trueVariance * trueVariance / MathNet.Numerics.Statistics.Statistics.Variance(estimates);
        double edf = AllanDeviation.WhiteFrequencyEdf(Count, m);
        Assert.InRange(edf / mcEdf, 0.88, 1.12);
    }

    [Fact]
    public void OctaveFactors_For1000Values_RunsTo256()
    {
        Assert.Equal([1, 2, 4, 8, 16, 32, 64, 128, 256], AllanDeviation.OctaveFactors(1000));
    }

    [Fact]
    public void Overlapping_FactorTooLarge_ThrowsNamingValidRange()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => AllanDeviation.Overlapping(new double[10], 1.0, [6]));
        Assert.Contains("1..5", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void FractionalDeviations_AreRelativeToReference()
    {
        Assert.Equal(
            [1e-6, -2e-6],
            AllanDeviation.FractionalDeviations([1000.001, 999.998], 1000.0),
            new ToleranceComparer(1e-15)
        );
    }

    /// <summary>SP 1065 overlapping ADEV, frequency-data form, written as the literal double sum.</summary>
    private static double BruteForce(double[] y, int m)
    {
        int terms = y.Length - (2 * m) + 1;
        double outer = 0;
        for (int j = 0; j < terms; j++)
        {
            double inner = 0;
            for (int i = j; i < j + m; i++)
            {
                inner += y[i + m] - y[i];
            }

            outer += inner * inner;
        }

        return Math.Sqrt(outer / (2.0 * m * m * terms));
    }

    private sealed class ToleranceComparer(double tolerance) : IEqualityComparer<double>
    {
        public bool Equals(double x, double y) => Math.Abs(x - y) <= tolerance;

        public int GetHashCode(double obj) => 0;
    }
}
