using SortRig.Measurement.Ranging;

namespace SortRig.Measurement.Tests.Ranging;

/// <summary>
/// Range rule on the invented test meter. Expected figures are hand arithmetic from the invented spec
/// (see <see cref="InventedMeter"/>), GUM 4.3.7 (a/√3) and the 4:1 ratio (common practice, no source).
/// </summary>
public sealed class RangeRuleTests
{
    private static readonly double s_root3 = Math.Sqrt(3);

    [Fact]
    public void Choose_TenKilohmOnePercent_PicksTenKilohmRangeAndResolves()
    {
        var d = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(10_000, 0.01, 0.001, 1, FourWire: true));

        // 10000 × 1.01 × 1.02 = 10302 Ohm <= 1.25 × 10 kOhm = 12500 Ohm.
        Assert.Equal(10_000, d.Range.FullScale);
        // 1 ppm of range at 1 NPLC: 0.01 Ohm = 1 ppm of nominal.
        Assert.Equal(0.01, d.ResolutionOhms, 12);
        Assert.Equal(1.0, d.ResolutionPpm, 9);
        // 24 h: 0.0025 % × 10 k + 0.0004 % × 10 k = 0.25 + 0.04 = 0.29 Ohm; 1 y: 0.0085 % + 0.0006 % → 0.85 + 0.06 =
        // 0.91 Ohm.
        Assert.Equal(0.29, d.SpecHalfWidth24Hours, 12);
        Assert.Equal(0.91, d.SpecHalfWidth1Year, 12);
        // Transfer: resolution 0.005/√3, noise 0.7 ppm × 10 k / √8, short term 0.1 × 0.29/√3 (u ≈ 0.01717 Ohm).
        var u = Math.Sqrt(Sq(0.005 / s_root3) + Sq(0.007 / Math.Sqrt(8)) + Sq(0.029 / s_root3));
        Assert.Equal(u, d.TransferUncertainty, 12);
        Assert.Equal(2 * u, d.ExpandedTransfer, 12);
        // Allowed: 1/4 × 0.1 % × 10 kOhm = 2.5 Ohm.
        Assert.Equal(2.5, d.AllowedExpanded, 12);
        Assert.Equal(RangeVerdict.Resolvable, d.Verdict);
        Assert.Empty(d.Remedies);
    }

    [Fact]
    public void Choose_NominalWhoseToleranceOverflowsRange_GoesUpOneRange()
    {
        // 12.2 kOhm × 1.01 × 1.02 = 12568.44 Ohm > 12500 Ohm → 100 kOhm range.
        var d = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(12_200, 0.01, 0.001, 1, true));
        Assert.Equal(100_000, d.Range.FullScale);
        // Without margin and tolerance 0.8 %: 12.2 k × 1.008 = 12297.6 Ohm fits the 10 kOhm range.
        var tight = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(12_200, 0.008, 0.001, 1, true, Margin: 0));
        Assert.Equal(10_000, tight.Range.FullScale);
    }

    [Fact]
    public void Choose_HundredOhmTwoWire_RefusedAndProposesFourWire()
    {
        var d = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(100, 0.01, 0.001, 1, FourWire: false));

        // Lead variation 0.1 Ohm rectangular: 0.0577 Ohm dominates; U ≈ 0.1155 Ohm > 0.25 × 0.1 % × 100 = 0.025 Ohm.
        Assert.Equal(RangeVerdict.Refused, d.Verdict);
        Assert.Equal(0.025, d.AllowedExpanded, 12);
        var four = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.UseFourWire);
        // 4-wire: resolution 0.5e-4/√3, noise 0.7e-4/√8, short term 0.1 × (0.0040 % + 0.0025 %) × 100 / √3 =
        // 0.00065/√3.
        var u4 = Math.Sqrt(Sq(0.5e-4 / s_root3) + Sq(0.7e-4 / Math.Sqrt(8)) + Sq(0.00065 / s_root3));
        Assert.Equal(u4, four.TransferUncertainty, 12);
        Assert.True(four.Resolves);
        // Longer integration cannot beat the lead term.
        var nplc = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.RaiseNplc);
        Assert.False(nplc.Resolves);
        // Loosen to U / (0.25 × 100) = 0.11547/25 = 0.004619, rounded up to two digits: 0.0047.
        var loosen = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.LoosenMatch);
        Assert.Equal(0.0047, loosen.Setting, 9);
        Assert.True(loosen.Resolves);
    }

    [Fact]
    public void Choose_FastNplcTightMatch_ProposesLowestSufficientNplc()
    {
        // 0.04 NPLC on 10 kOhm: step 40 ppm = 0.4 Ohm → 0.2/√3 = 0.1155 Ohm; noise 12 ppm = 0.12 Ohm/√8; short term
        // 0.029/√3: U ≈ 0.248 Ohm > 0.25 × 0.005 % × 10 k = 0.125 Ohm.
        var d = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(10_000, 0.01, 0.00005, 0.04, true));
        Assert.Equal(RangeVerdict.Refused, d.Verdict);
        // 0.4 NPLC: 0.02/√3, 0.02/√8, 0.029/√3 → U ≈ 0.0431 Ohm <= 0.125 Ohm.
        var nplc = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.RaiseNplc);
        Assert.Equal(0.4, nplc.Setting);
        Assert.True(nplc.Resolves);
        Assert.Equal(
            2 * Math.Sqrt(Sq(0.02 / s_root3) + Sq(0.02 / Math.Sqrt(8)) + Sq(0.029 / s_root3)),
            nplc.ExpandedTransfer,
            12
        );
    }

    [Fact]
    public void Choose_TenPpmMatch_ShortTermDominates_NoNplcResolves()
    {
        // Short-term 0.029/√3 = 0.0167 Ohm alone gives U = 0.0335 Ohm > 0.25 × 10 ppm × 10 k = 0.025 Ohm.
        var d = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(10_000, 0.01, 0.00001, 0.04, true));
        Assert.Equal(RangeVerdict.Refused, d.Verdict);
        var nplc = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.RaiseNplc);
        Assert.False(nplc.Resolves);
        // The best it can do is the longest setting, 40 NPLC (U ≈ 0.0335 Ohm).
        Assert.Equal(40, nplc.Setting);
        Assert.DoesNotContain(d.Remedies, r => r.Kind == RemedyKind.UseFourWire);
    }

    [Fact]
    public void Choose_UncertaintyRatioOption_ChangesVerdict()
    {
        // 1 NPLC, 10 ppm match: U = 2 × 0.01717 = 0.0343 Ohm; 4:1 allows 0.025 Ohm (refused), 2:1 allows 0.05 Ohm.
        var request = new RangeRequest(10_000, 0.01, 0.00001, 1, true);
        Assert.Equal(RangeVerdict.Refused, RangeRule.Choose(InventedMeter.Spec(), request).Verdict);
        var relaxed = RangeRule.Choose(InventedMeter.Spec(), request, new RangeRuleOptions { UncertaintyRatio = 0.5 });
        Assert.Equal(RangeVerdict.Resolvable, relaxed.Verdict);
    }

    [Fact]
    public void Choose_JustOverRange_ProposesLowerRangeWhenNominalFits()
    {
        // 12 kOhm, 5 % stock: 12 k × 1.05 × 1.02 = 12852 Ohm > 12500 Ohm → 100 kOhm range; at 0.04 NPLC the 4 Ohm step
        // gives U ≈ 2.46 Ohm > 0.25 × 0.05 % × 12 k = 1.5 Ohm. 12 k × 1.02 = 12240 Ohm fits the 10 kOhm range,
        // where U ≈ 0.249 Ohm (0.2/√3, 0.12/√8, 0.1 × (0.3 + 0.04)/√3).
        var d = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(12_000, 0.05, 0.0005, 0.04, true));
        Assert.Equal(100_000, d.Range.FullScale);
        Assert.Equal(RangeVerdict.Refused, d.Verdict);
        var range = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.UseRange);
        Assert.Equal(10_000, range.Setting);
        Assert.True(range.Resolves);
    }

    [Fact]
    public void Choose_AboveLargestRange_ThrowsWithTheLimits()
    {
        // 70 MOhm × 1.01 × 1.02 = 72.1 MOhm > 62.5 MOhm, the 50 MOhm range limit (1.25 × 50 MOhm).
        var ex = Assert.Throws<ArgumentException>(() =>
            RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(70e6, 0.01, 0.001, 1, true))
        );
        Assert.Contains("6.25E+07", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Choose_UnknownNplc_ThrowsListingSettings()
    {
        var ex = Assert.Throws<ArgumentException>(() =>
            RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(10_000, 0.01, 0.001, 5, true))
        );
        Assert.Contains("0.04, 0.4, 1, 4, 10, 40", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Choose_FourWireOnTwoWireMeter_Throws()
    {
        Assert.Throws<ArgumentException>(() =>
            RangeRule.Choose(InventedMeter.Spec(fourWire: false), new RangeRequest(100, 0.01, 0.001, 1, true))
        );
    }

    [Fact]
    public void Request_InvalidMatchTolerance_ThrowsNamingIt()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new RangeRequest(10_000, 0.01, 0, 1, true));
        Assert.Equal("MatchTolerance", ex.ParamName);
    }

    private static double Sq(double x) => x * x;
}
