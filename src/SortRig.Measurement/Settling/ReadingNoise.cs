namespace SortRig.Measurement.Settling;

/// <summary>One stationary Ornstein-Uhlenbeck component of the reading noise: covariance
/// <c>Variance · exp(−|Δt| / CorrelationTime)</c>.</summary>
/// <param name="Variance">The component's variance (square of the readings' unit).</param>
/// <param name="CorrelationTime">Its correlation time, s.</param>
public sealed record CorrelatedNoise(double Variance, double CorrelationTime);

/// <summary>Gaussian reading noise of known covariance: white noise of standard deviation <paramref name="WhiteSigma"/>
/// plus independent stationary <see cref="CorrelatedNoise"/> components (a sum of Lorentzians, e.g. 1/f-like noise
/// over a few decades), for <see cref="AsymptoteBound.Variances"/>.</summary>
/// <param name="WhiteSigma">Standard deviation of the white part (readings' unit).</param>
/// <param name="Components">The correlated components; empty for white noise.</param>
public sealed record ReadingNoise(double WhiteSigma, IReadOnlyList<CorrelatedNoise> Components)
{
    /// <summary>White noise alone.</summary>
    public static ReadingNoise White(double sigma) => new(sigma, []);
}
