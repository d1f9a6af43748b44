using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

public sealed class BatchMeansTests
{
    [Theory]
    [InlineData(1, 0.0)]
    [InlineData(2, 0.5)]
    [InlineData(3, 0.8)]
    public void Ar1Series_FactorApproachesTheLongRunVarianceRatio(int seed, double phi)
    {
        // Textbook identity (Box and Jenkins, from memory): an AR(1) process x_k = φ x_(k−1) + e_k has long-run
        // variance (the limit of m Var(mean of m)) σ²_x (1 + φ)/(1 − φ); for blocks of m the exact value is σ²_x ((1 +
        // φ)/(1 − φ) − 2φ(1 − φ^m)/(m (1 − φ)²)).
        const int M = 100;
        var noise = ReadingScript.Gaussian(seed, 1);
        var x = new double[200_000];
        var previous = noise() / Math.Sqrt(1 - (phi * phi));
        for (var i = 0; i < x.Length; i++)
        {
            previous = (phi * previous) + noise();
            x[i] = previous;
        }

        var variance = 1 / (1 - (phi * phi));
        var expected = ((1 + phi) / (1 - phi)) - (2 * phi * (1 - Math.Pow(phi, M)) / (M * (1 - phi) * (1 - phi)));

        var factor = BatchMeans.Inflation(x, M, 0, variance);

        // 2 000 blocks: the estimate's relative standard deviation is about √(2/2000) = 3 %.
        Assert.InRange(factor, expected * 0.88, expected * 1.12);
    }

    [Fact]
    public void SlowWanderUnderWhiteNoise_SeenByBlocksWhereTheLagOneFactorMissesIt()
    {
        // A 0.5-unit wander with a 4 s period under white noise of 1 unit at 24 readings a second (the shape of a
        // part's 1/f excess noise under a meter's white noise; invented numbers). Lag one sees a correlation of about
        // 0.125 / 1.125 = 0.11, a factor (1 + ρ)/(1 − ρ) of 1.25; blocks of half a second (12 readings) see the
        // wander's variance 0.125 twelve times over: (12 × 0.122 + 1) / 1.125 = 2.2 (arithmetic of the two
        // definitions).
        var noise = ReadingScript.Gaussian(7, 1);
        var r = Enumerable.Range(0, 2400).Select(i => (0.5 * Math.Sin(2 * Math.PI * i / 96.0)) + noise()).ToArray();
        var s2 = r.Sum(v => v * v) / r.Length;
        var rho = r.Skip(1).Select((v, i) => v * r[i]).Sum() / r.Sum(v => v * v);

        var factor = BatchMeans.Inflation(r, 12, 0, s2);

        Assert.InRange((1 + rho) / (1 - rho), 1.1, 1.4);
        Assert.InRange(factor, 1.7, 2.8);
    }

    [Fact]
    public void TooFewBlocks_NoJudgement()
    {
        // Six blocks of two readings with a five-parameter model leave one block's worth of freedom: no estimate.
        Assert.True(double.IsNaN(BatchMeans.Inflation(new double[12], 2, 5, 1)));
    }

    [Theory]
    [InlineData(7)]
    [InlineData(8)]
    public void SlowWander_IsReadByTheLongerBlocksOfTheBlockingAnalysis(int seed)
    {
        // Blocking analysis (Flyvbjerg and Petersen 1989, from memory): for white noise σ² plus a square wave of
        // amplitude a and half-period P readings, m Var(block mean) ≈ σ² + m a² for blocks m ≪ P: the factor grows
        // with the block. 600 readings 41 ms apart, σ = 1, a = 0.3, P = 150: the quarter-second block (6 readings)
        // reads about 1 + 6 × 0.09 ≈ 1.5, the doubled blocks up to 48 readings about 1 + 48 × 0.09 ≈ 5.
        var noise = ReadingScript.Gaussian(seed, 1);
        var r = Enumerable.Range(0, 600).Select(i => noise() + ((i / 150) % 2 == 0 ? 0.3 : -0.3)).ToArray();
        var s2 = r.Sum(x => x * x) / (r.Length - 5);

        var quarterSecond = BatchMeans.Inflation(r, 6, 5, s2);
        var blocking = PredictiveSettling.SlowNoiseInflation(r, 599 * 0.041, 5);

        Assert.InRange(quarterSecond, 0.8, 2.5);
        Assert.True(blocking > 3, $"blocking {blocking}, quarter second {quarterSecond}");
    }
}
