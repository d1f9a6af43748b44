using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

public sealed class ClopperPearsonTests
{
    [Theory]
    [InlineData(3_000)]
    [InlineData(1_000)]
    [InlineData(33_000)]
    public void NoFailures_UpperBoundIsTheRuleOfThree(int trials)
    {
        // Referee: the "rule of three" (Hanley and Lippman-Hand, JAMA 249, 1983, from memory): with 0 events in n
        // trials the one-sided 95 % upper bound is about 3/n (−ln 0.05 = 2.996, so 2.996/n to first order in 1/n).
        var upper = ClopperPearson.Upper(0, trials);

        Assert.Equal(-Math.Log(0.05) / trials, upper, 0.01 / trials);
        Assert.InRange(upper, 2.9 / trials, 3.0 / trials);
    }

    [Theory]
    [InlineData(1, 10)]
    [InlineData(3, 3_000)]
    [InlineData(5, 13_000)]
    [InlineData(7, 250)]
    public void SomeFailures_BinomialTailAtTheBoundIsFivePercent(int failures, int trials)
    {
        // Referee: the definition by brute force (Clopper and Pearson, Biometrika 26, 1934): the upper bound p is the
        // one at which P(X ≤ x | n, p) = 0.05, the binomial tail summed term by term here (each term from the last by
        // the ratio (n − k)/(k + 1) · p/(1 − p)), not through the Beta function the code uses.
        var upper = ClopperPearson.Upper(failures, trials);

        Assert.Equal(0.05, BinomialTail(failures, trials, upper), 1e-9);
        Assert.True(BinomialTail(failures, trials, upper * 0.99) > 0.05);
    }

    [Fact]
    public void ManyTrialsFewFailures_MatchesThePoissonLimitFromTheChiSquareTable()
    {
        // Referee: for large n the bound tends to the Poisson (Garwood 1936) upper limit χ²₀.₉₅(2(x + 1)) / (2n);
        // χ²₀.₉₅ with 8 degrees of freedom is 15.507 (any textbook χ² table, e.g. Abramowitz and Stegun table 26.8,
        // from memory). x = 3, n = 100 000: 7.754e-5, the binomial a relative 1e-4 or so above.
        var upper = ClopperPearson.Upper(3, 100_000);

        Assert.Equal(15.507 / 200_000, upper, 2e-8);
    }

    private static double BinomialTail(int failures, int trials, double p)
    {
        var term = Math.Pow(1 - p, trials);
        var sum = term;
        for (var k = 0; k < failures; k++)
        {
            term *= (trials - k) / (k + 1.0) * p / (1 - p);
            sum += term;
        }

        return sum;
    }
}
