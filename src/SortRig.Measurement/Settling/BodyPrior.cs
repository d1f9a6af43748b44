namespace SortRig.Measurement.Settling;

/// <summary>
/// What the reel's resolved parts say about the next part's body time constant, as a distribution of ln τ_body: the
/// posterior predictive of a normal population with unknown mean and variance under the non-informative prior, a
/// Student t with n − 1 degrees of freedom, centre the estimates' mean and scale s √(1 + 1/n) (Gelman et al.,
/// Bayesian Data Analysis, sec. 3.2, from memory). The heavier tails of few parts are the uncertainty of a spread
/// learned from few of them; with many the prior tends to the normal of the reel's spread. Used by the predictive rule
/// as a penalty on ln τ_body in its profile likelihood (<see cref="ExponentialFitter.PenalizedInterval"/>).
/// </summary>
/// <param name="LogMean">Centre, ln s.</param>
/// <param name="LogScale">Scale of ln τ (dimensionless): for a normal prior its standard deviation.</param>
/// <param name="Dof">Degrees of freedom; +∞: the normal.</param>
public sealed record BodyPrior(double LogMean, double LogScale, double Dof)
{
    /// <summary>
    /// −2 ln of the prior density of ln τ, up to a constant, zero at the centre: z² for the normal, (ν + 1) ln(1 +
    /// z²/ν) for Student's t, z = (ln τ − centre) / scale. The prior's deviance, on the scale of RSS / s².
    /// </summary>
    public double Penalty(double tau)
    {
        var z = (Math.Log(tau) - LogMean) / LogScale;
        return double.IsPositiveInfinity(Dof) ? z * z : (Dof + 1) * Math.Log(1 + (z * z / Dof));
    }

    /// <summary>The |z| at which <see cref="Penalty"/> reaches <paramref name="penalty"/> (its inverse).</summary>
    public double Reach(double penalty) =>
        double.IsPositiveInfinity(Dof) ? Math.Sqrt(penalty) : Math.Sqrt(Dof * (Math.Exp(penalty / (Dof + 1)) - 1));
}
