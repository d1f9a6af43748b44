using SortRig.Measurement.Control;

namespace SortRig.Measurement.Tests.Control;

public sealed class EwmaTests
{
    // NIST/SEMATECH e-Handbook of Statistical Methods sec. 6.3.2.4, worked example (data from memory):
    // target 50, s = 2.0539, lambda = 0.3, k = 3; the handbook's limits are 50 ± 3 * 0.4201 * 2.0539
    // = 52.5884 / 47.4115, and its EWMA column begins 50.60, 49.52, 50.56.
    private static readonly double[] s_data =
    [
        52.0,
        47.0,
        53.0,
        49.3,
        50.1,
        47.0,
        51.0,
        50.1,
        51.2,
        50.5,
        49.6,
        47.6,
        49.9,
        51.3,
        47.8,
        51.2,
        52.6,
        52.4,
        53.6,
        52.1,
    ];

    private static readonly EwmaOptions s_options = new() { Lambda = 0.3, Width = 3 };

    [Fact]
    public void Statistics_HandbookExample_MatchesFirstValues()
    {
        double[] z = Ewma.Statistics(s_data, 50, 0.3);

        // z1 = 0.3*52 + 0.7*50 = 50.6; z2 = 0.3*47 + 0.7*50.6 = 49.52; z3 = 0.3*53 + 0.7*49.52 = 50.564
        Assert.Equal(50.6, z[0], 10);
        Assert.Equal(49.52, z[1], 10);
        Assert.Equal(50.564, z[2], 10);
        Assert.All(z, v => Assert.InRange(v, 47.4115, 52.5884)); // the handbook finds the process in control
    }

    [Fact]
    public void SteadyHalfWidth_HandbookExample_MatchesPublishedLimits()
    {
        double half = Ewma.SteadyHalfWidth(2.0539, s_options);

        Assert.Equal(52.5884, 50 + half, 3);
        Assert.Equal(47.4115, 50 - half, 3);
    }

    [Fact]
    public void HalfWidth_ExactLimits_StartAtLambdaSigmaAndTendToSteadyState()
    {
        // Textbook identity (Montgomery ch. 9.2): at i = 1 the factor lambda/(2-lambda)(1-(1-lambda)^2) = lambda^2,
        // so the half-width is L * sigma * lambda = 3 * 2.0539 * 0.3 = 1.84851.
        Assert.Equal(1.84851, Ewma.HalfWidth(1, 2.0539, s_options), 5);
        Assert.Equal(Ewma.SteadyHalfWidth(2.0539, s_options), Ewma.HalfWidth(200, 2.0539, s_options), 10);
        for (int i = 1; i < 30; i++)
        {
            Assert.True(Ewma.HalfWidth(i, 1, s_options) < Ewma.HalfWidth(i + 1, 1, s_options));
        }
    }

    [Fact]
    public void Options_LambdaOutOfRange_NamesTheOption()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new EwmaOptions { Lambda = 0 });
        Assert.Equal("Lambda", ex.ParamName);
    }
}
