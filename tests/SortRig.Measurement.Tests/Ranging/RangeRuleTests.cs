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

        // 10000 × 1.01 × 1.02 = 10302 Ohm <= 1.2 × 10 kOhm = 12000 Ohm.
        Assert.Equal(10_000, d.Range.FullScale);
        // 1 ppm of range at 1 NPLC: 0.01 Ohm = 1 ppm of nominal.
        Assert.Equal(0.01, d.ResolutionOhms, 12);
        Assert.Equal(1.0, d.ResolutionPpm, 9);
        // 24 h: 0.0020 % × 10 k + 0.0005 % × 10 k = 0.25 Ohm; 1 y: 0.0100 % + 0.0010 % → 1.1 Ohm.
        Assert.Equal(0.25, d.SpecHalfWidth24Hours, 12);
        Assert.Equal(1.1, d.SpecHalfWidth1Year, 12);
        // Transfer: resolution 0.005/√3, noise 0.6 ppm × 10 k / √8, short term 0.1 × 0.25/√3.
        var u = Math.Sqrt(Sq(0.005 / s_root3) + Sq(0.006 / Math.Sqrt(8)) + Sq(0.025 / s_root3));
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
        // 11.9 kOhm × 1.01 × 1.02 = 12259.8 Ohm > 12000 Ohm → 100 kOhm range.
        var d = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(11_900, 0.01, 0.001, 1, true));
        Assert.Equal(100_000, d.Range.FullScale);
        // Without margin and tolerance 0.8 %: 11.9 k × 1.008 = 11995.2 Ohm fits the 10 kOhm range.
        var tight = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(11_900, 0.008, 0.001, 1, true, Margin: 0));
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
        // 4-wire: resolution 0.5e-4/√3, noise 0.6e-4/√8, short term 0.1 × (0.003 % + 0.003 %) × 100 / √3 = 0.0006/√3.
        var u4 = Math.Sqrt(Sq(0.5e-4 / s_root3) + Sq(0.6e-4 / Math.Sqrt(8)) + Sq(0.0006 / s_root3));
        Assert.Equal(u4, four.TransferUncertainty, 12);
        Assert.True(four.Resolves);
        // Longer integration cannot beat the lead term.
        var nplc = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.RaiseNplc);
        Assert.False(nplc.Resolves);
        // Loosen to U / (0.25 × 100) = 0.1155/25 = 0.00462, rounded up to two digits: 0.0047.
        var loosen = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.LoosenMatch);
        Assert.Equal(0.0047, loosen.Setting, 9);
        Assert.True(loosen.Resolves);
    }

    [Fact]
    public void Choose_FastNplcTightMatch_ProposesLowestSufficientNplc()
    {
        // 0.02 NPLC on 10 kOhm: step 1 Ohm → 0.5/√3 = 0.289 Ohm, U ≈ 0.616 Ohm > 0.25 × 0.02 % × 10 k = 0.5 Ohm.
        var d = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(10_000, 0.01, 0.0002, 0.02, true));
        Assert.Equal(RangeVerdict.Refused, d.Verdict);
        // 0.2 NPLC: 0.05/√3, 0.03/√8, 0.025/√3 → U ≈ 0.068 Ohm <= 0.5 Ohm.
        var nplc = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.RaiseNplc);
        Assert.Equal(0.2, nplc.Setting);
        Assert.True(nplc.Resolves);
        Assert.Equal(2 * Math.Sqrt(Sq(0.05 / s_root3) + Sq(0.03 / Math.Sqrt(8)) + Sq(0.025 / s_root3)), nplc.ExpandedTransfer, 12);
    }

    [Fact]
    public void Choose_TenPpmMatch_ShortTermDominates_NoNplcResolves()
    {
        // Short-term 0.025/√3 = 0.0144 Ohm alone gives U = 0.029 Ohm > 0.25 × 10 ppm × 10 k = 0.025 Ohm.
        var d = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(10_000, 0.01, 0.00001, 0.02, true));
        Assert.Equal(RangeVerdict.Refused, d.Verdict);
        var nplc = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.RaiseNplc);
        Assert.False(nplc.Resolves);
        Assert.Equal(100, nplc.Setting);
        Assert.DoesNotContain(d.Remedies, r => r.Kind == RemedyKind.UseFourWire);
    }

    [Fact]
    public void Choose_UncertaintyRatioOption_ChangesVerdict()
    {
        // 1 NPLC, 10 ppm match: U = 0.0297 Ohm; 4:1 allows 0.025 Ohm (refused), 2:1 allows 0.05 Ohm.
        var request = new RangeRequest(10_000, 0.01, 0.00001, 1, true);
        Assert.Equal(RangeVerdict.Refused, RangeRule.Choose(InventedMeter.Spec(), request).Verdict);
        var relaxed = RangeRule.Choose(InventedMeter.Spec(), request, new RangeRuleOptions { UncertaintyRatio = 0.5 });
        Assert.Equal(RangeVerdict.Resolvable, relaxed.Verdict);
    }

    [Fact]
    public void Choose_JustOverRange_ProposesLowerRangeWhenNominalFits()
    {
        // 11.5 kOhm, 5 % stock: 11.5 k × 1.05 × 1.02 = 12316.5 Ohm → 100 kOhm range; at 0.02 NPLC the 10 Ohm step
        // gives U ≈ 6.2 Ohm > 0.25 × 0.1 % × 11.5 k = 2.875 Ohm. 11.5 k × 1.02 = 11730 Ohm fits the 10 kOhm range.
        var d = RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(11_500, 0.05, 0.001, 0.02, true));
        Assert.Equal(100_000, d.Range.FullScale);
        Assert.Equal(RangeVerdict.Refused, d.Verdict);
        var range = Assert.Single(d.Remedies, r => r.Kind == RemedyKind.UseRange);
        Assert.Equal(10_000, range.Setting);
        Assert.True(range.Resolves);
    }

    [Fact]
    public void Choose_AboveLargestRange_ThrowsWithTheLimits()
    {
        // 20 MOhm × 1.01 × 1.02 > 12 MOhm, the 10 MOhm range limit.
        var ex = Assert.Throws<ArgumentException>(() => RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(20e6, 0.01, 0.001, 1, true)));
        Assert.Contains("1.2E+07", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Choose_UnknownNplc_ThrowsListingSettings()
    {
        var ex = Assert.Throws<ArgumentException>(() => RangeRule.Choose(InventedMeter.Spec(), new RangeRequest(10_000, 0.01, 0.001, 5, true)));
        Assert.Contains("0.02, 0.2, 1, 10, 100", ex.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Choose_FourWireOnTwoWireMeter_Throws()
    {
        Assert.Throws<ArgumentException>(() => RangeRule.Choose(InventedMeter.Spec(fourWire: false), new RangeRequest(100, 0.01, 0.001, 1, true)));
    }

    [Fact]
    public void Request_InvalidMatchTolerance_ThrowsNamingIt()
    {
        var ex = Assert.Throws<ArgumentOutOfRangeException>(() => new RangeRequest(10_000, 0.01, 0, 1, true));
        Assert.Equal("MatchTolerance", ex.ParamName);
    }

    private static double Sq(double x) => x * x;
}
