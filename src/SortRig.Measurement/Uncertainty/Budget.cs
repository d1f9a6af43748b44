using MathNet.Numerics.Distributions;

namespace SortRig.Measurement.Uncertainty;

/// <summary>
/// An uncertainty budget of uncorrelated input components (JCGM 100:2008 sec. 5.1): combined
/// standard uncertainty, Welch-Satterthwaite effective degrees of freedom and expanded uncertainty.
/// </summary>
/// <param name="Components">The lines of the budget; may be empty (u_c = 0).</param>
public sealed record Budget(IReadOnlyList<BudgetComponent> Components)
{
    /// <summary>The level of confidence that k = 2 gives for a normal distribution, 95.45 % (JCGM 100:2008 G.2.3, Table
    /// G.1).</summary>
    public const double TwoSigmaLevel = 0.9545;

    /// <summary>Creates a budget from components.</summary>
    public Budget(params BudgetComponent[] components)
        : this((IReadOnlyList<BudgetComponent>)components) { }

    /// <summary>Combined standard uncertainty u_c(y) = √Σ (c_i u(x_i))² (JCGM 100:2008 eq. 10), unit of the
    /// output.</summary>
    public double CombinedStandardUncertainty
    {
        get
        {
            var sum = 0.0;
            foreach (var c in Components)
            {
                sum += c.Contribution * c.Contribution;
            }

            return Math.Sqrt(sum);
        }
    }

    /// <summary>
    /// Welch-Satterthwaite effective degrees of freedom ν_eff = u_c⁴ / Σ (u_i⁴/ν_i) (JCGM 100:2008 G.4.1, eq. G.2b).
    /// +∞ when every contributing component has infinite ν or u_c = 0. Not truncated.
    /// </summary>
    public double EffectiveDegreesOfFreedom
    {
        get
        {
            var uc = CombinedStandardUncertainty;
            var denominator = 0.0;
            foreach (var c in Components)
            {
                if (!double.IsPositiveInfinity(c.DegreesOfFreedom))
                {
                    var ui = c.Contribution;
                    denominator += ui * ui * ui * ui / c.DegreesOfFreedom;
                }
            }

            return denominator > 0 && uc > 0 ? uc * uc * uc * uc / denominator : double.PositiveInfinity;
        }
    }

    /// <summary>Expanded uncertainty U = k u_c (JCGM 100:2008 eq. 18). <paramref name="coverageFactor"/> default 2,
    /// must be &gt; 0.</summary>
    public double Expanded(double coverageFactor = 2.0) =>
        coverageFactor > 0 && double.IsFinite(coverageFactor)
            ? coverageFactor * CombinedStandardUncertainty
            : throw new ArgumentOutOfRangeException(
                nameof(coverageFactor),
                coverageFactor,
                "Coverage factor k must be finite and > 0."
            );

    /// <summary>
    /// Coverage factor k = t_p(ν_eff) from Student's t for a level of confidence p (JCGM 100:2008 G.4.1, G.6.4),
    /// with ν_eff first stated to one decimal (as the Guide's examples state it: 16.7, 19.0) and then truncated to
    /// the next lower integer as G.4.1 allows; the normal quantile when ν_eff is infinite.
    /// </summary>
    /// <param name="level">Level of confidence p in (0, 1); default 0.9545 (k = 2 for ν = ∞).</param>
    public double CoverageFactorAt(double level = TwoSigmaLevel)
    {
        if (!(level > 0 && level < 1))
        {
            throw new ArgumentOutOfRangeException(
                nameof(level),
                level,
                "Level of confidence must be in (0, 1), e.g. 0.9545."
            );
        }

        var q = (1.0 + level) / 2.0;
        var nu = EffectiveDegreesOfFreedom;
        return double.IsPositiveInfinity(nu) || nu > 1e7
            ? Normal.InvCDF(0, 1, q)
            : StudentT.InvCDF(0, 1, Math.Max(1.0, Math.Floor(Math.Round(nu, 1))), q);
    }

    /// <summary>Expanded uncertainty U_p = t_p(ν_eff) u_c at a level of confidence (see <see
    /// cref="CoverageFactorAt"/>).</summary>
    public double ExpandedAt(double level = TwoSigmaLevel) => CoverageFactorAt(level) * CombinedStandardUncertainty;
}
