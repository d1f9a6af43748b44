using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Tests.Uncertainty;

public sealed class BudgetTests
{
    /// <summary>
    /// JCGM 100:2008 Annex H.1, end-gauge calibration, Table H.1 (component figures from memory), in nm.
    /// l_s = 50 mm, θ = −0.1 degC, α_s = 11.5e-6 /degC.
    /// </summary>
    private static Budget EndGauge()
    {
        const double ls = 50e6; // nm
        const double theta = -0.1;
        const double alphaS = 11.5e-6;
        return new Budget(
            new BudgetComponent("l_s, calibration of standard", TypeB.FromExpanded(75, 3), 1, 18),
            new BudgetComponent("d, measured difference", 9.7, 1, 25.6),
            new BudgetComponent("alpha_s, expansion coefficient", TypeB.Rectangular(2e-6), 0, double.PositiveInfinity),
            new BudgetComponent("theta, temperature of bed", 0.41, 0, double.PositiveInfinity),
            new BudgetComponent("delta alpha, expansion difference", TypeB.Rectangular(1e-6), -ls * theta, 50),
            new BudgetComponent("delta theta, temperature difference", TypeB.Rectangular(0.05), -ls * alphaS, 2)
        );
    }

    [Fact]
    public void EndGauge_CombinedStandardUncertainty_Is32Nm()
    {
        // JCGM 100:2008 H.1.4: u_c(l) = 32 nm (u_c² = 1002 nm²); from memory, as are the Table H.1 inputs above.
        var uc = EndGauge().CombinedStandardUncertainty;
        Assert.InRange(uc, 31.5, 32.5);
        Assert.InRange(uc * uc, 1000, 1005);
    }

    [Fact]
    public void EndGauge_WelchSatterthwaite_Is16AfterTruncation()
    {
        // JCGM 100:2008 H.1.6: ν_eff(l) ≈ 16.7, taken as 16 (G.4.1 truncation); from memory.
        var nu = EndGauge().EffectiveDegreesOfFreedom;
        Assert.InRange(nu, 16.0, 17.0);
    }

    [Fact]
    public void EndGauge_ExpandedAt99Percent_Is93Nm()
    {
        // JCGM 100:2008 H.1.6: t_99(16) = 2.92, U_99 = 2.92 × 32 nm = 93 nm; from memory.
        var budget = EndGauge();
        Assert.Equal(2.92, budget.CoverageFactorAt(0.99), 2);
        Assert.InRange(budget.ExpandedAt(0.99), 92.0, 94.0);
    }

    [Fact]
    public void WelchSatterthwaite_GuideExampleG41_Gives19DegreesOfFreedom()
    {
        // JCGM 100:2008 G.4.1 example (from memory): relative u 0.25 % (n = 10), 0.57 % (n = 5), 0.82 % (n = 15);
        // u_c = 1.03 %, ν_eff = 19.0, t_95(19) = 2.09, U_95 = 2.2 %.
        var budget = new Budget(
            new BudgetComponent("x1", 0.25, 1, 9, UncertaintyKind.TypeA),
            new BudgetComponent("x2", 0.57, 1, 4, UncertaintyKind.TypeA),
            new BudgetComponent("x3", 0.82, 1, 14, UncertaintyKind.TypeA)
        );
        Assert.Equal(1.03, budget.CombinedStandardUncertainty, 2);
        Assert.Equal(19.0, budget.EffectiveDegreesOfFreedom, 0);
        Assert.Equal(2.09, budget.CoverageFactorAt(0.95), 2);
        Assert.InRange(budget.ExpandedAt(0.95), 2.15, 2.25);
    }

    [Fact]
    public void CoverageFactor_InfiniteDegreesOfFreedom_IsTwoAt9545Percent()
    {
        // JCGM 100:2008 Table G.1: p = 95.45 % ↔ k = 2 for a normal distribution (from memory; also the normal
        // distribution's 2-sigma coverage, textbook identity).
        var budget = new Budget(new BudgetComponent("b", 1.0));
        Assert.Equal(2.0, budget.CoverageFactorAt(), 3);
        Assert.True(double.IsPositiveInfinity(budget.EffectiveDegreesOfFreedom));
        Assert.Equal(2.0, budget.Expanded(), 12);
    }

    [Fact]
    public void CoverageFactor_TenDegreesOfFreedom_MatchesGuideTableG2()
    {
        // JCGM 100:2008 Table G.2 (from memory): ν = 10 → t_95 = 2.23, t_95.45 = 2.28, t_99 = 3.17.
        var budget = new Budget(new BudgetComponent("a", 1.0, 1, 10, UncertaintyKind.TypeA));
        Assert.Equal(2.23, budget.CoverageFactorAt(0.95), 2);
        Assert.Equal(2.28, budget.CoverageFactorAt(), 2);
        Assert.Equal(3.17, budget.CoverageFactorAt(0.99), 2);
    }

    [Fact]
    public void Component_NegativeUncertainty_ThrowsNamingIt()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new BudgetComponent("bad", -1));
        Assert.Contains("bad", ex.Message, StringComparison.Ordinal);
    }
}
