namespace SortRig.Simulator.Physics;

/// <summary>The shape of the spread of true values around nominal on a reel.</summary>
public enum ValueDistributionKind
{
    /// <summary>Gaussian, unbounded: a few parts may fall outside the tolerance.</summary>
    Normal = 0,

    /// <summary>Uniform over the whole tolerance band.</summary>
    Uniform = 1,

    /// <summary>Gaussian clipped to the tolerance band with the centre culled (tight parts sold as a better
    /// grade).</summary>
    Bimodal = 2,

    /// <summary>Gaussian clipped to the tolerance band (out-of-tolerance parts rejected at the factory).</summary>
    Truncated = 3,
}

/// <summary>
/// How true values spread around nominal. Deviations are expressed as a fraction of the tolerance
/// half-width: -1 is the lower tolerance limit, +1 the upper.
/// </summary>
/// <param name="Kind">Shape of the distribution.</param>
/// <param name="Sigma">Standard deviation of the underlying Gaussian, as a fraction of the tolerance half-width; (0,
/// 5]. Ignored by Uniform.</param>
/// <param name="CentreGap">Bimodal only: parts with |deviation| below this fraction of the tolerance are missing; [0,
/// 1).</param>
public sealed record ValueDistribution(ValueDistributionKind Kind, double Sigma, double CentreGap)
{
    /// <summary>Unbounded Gaussian with sigma as a fraction of the tolerance half-width.</summary>
    public static ValueDistribution Normal(double sigma) => new(ValueDistributionKind.Normal, sigma, 0);

    /// <summary>Uniform over the tolerance band.</summary>
    public static ValueDistribution Uniform() => new(ValueDistributionKind.Uniform, 1, 0);

    /// <summary>Gaussian clipped to the band with |deviation| &lt; <paramref name="centreGap"/> culled.</summary>
    public static ValueDistribution Bimodal(double sigma, double centreGap) =>
        new(ValueDistributionKind.Bimodal, sigma, centreGap);

    /// <summary>Gaussian clipped to the tolerance band.</summary>
    public static ValueDistribution Truncated(double sigma) => new(ValueDistributionKind.Truncated, sigma, 0);

    /// <summary>Probability that one Gaussian draw is kept by the rejection rule (1 for Normal and Uniform).</summary>
    internal double AcceptanceProbability()
    {
        double Phi(double x) => MathNet.Numerics.Distributions.Normal.CDF(0, Sigma, x);
        return Kind switch
        {
            ValueDistributionKind.Truncated => Phi(1) - Phi(-1),
            ValueDistributionKind.Bimodal => 2 * (Phi(1) - Phi(CentreGap)),
            _ => 1.0,
        };
    }
}
