namespace SortRig.Measurement.Settling;

/// <summary>
/// One least-squares fit of a recovery model, in the fitter's units (seconds from the first fitted reading; values
/// relative to a reference). <see cref="VarianceOfFinal"/> is s² (JᵀJ)⁻¹ for A, s² = RSS / (n − p) floored at the
/// reading's quantisation variance; ∞ when the Jacobian is singular.
/// </summary>
internal sealed record ExponentialFit(
    RecoveryModel Model,
    double Final,
    double VarianceOfFinal,
    double[] Amplitudes,
    double[] TimeConstants,
    double Rss,
    int Count,
    bool Converged
)
{
    /// <summary>s² (JᵀJ)⁻¹ for the slowest time constant, s²; ∞ when the Jacobian is singular.</summary>
    public double VarianceOfSlowest { get; init; } = double.PositiveInfinity;

    /// <summary>Number of fitted parameters p: A, and one amplitude and one time constant per exponential.</summary>
    public int Parameters => 1 + (2 * TimeConstants.Length);

    /// <summary>Corrected Akaike information criterion (Hurvich and Tsai 1989, from memory): n ln(RSS/n) + 2p +
    /// 2p(p+1)/(n−p−1).</summary>
    public double Aicc
    {
        get
        {
            var p = Parameters;
            return Count - p - 1 <= 0
                ? double.PositiveInfinity
                : (Count * Math.Log(Math.Max(Rss, 1e-300) / Count)) + (2 * p) + (2.0 * p * (p + 1) / (Count - p - 1));
        }
    }

    /// <summary>The model's value at time t (seconds from the first fitted reading).</summary>
    public double At(double t)
    {
        var y = Final;
        for (var j = 0; j < TimeConstants.Length; j++)
        {
            y += Amplitudes[j] * Math.Exp(-t / TimeConstants[j]);
        }

        return y;
    }
}
