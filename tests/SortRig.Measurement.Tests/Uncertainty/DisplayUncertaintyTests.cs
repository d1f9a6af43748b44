using SortRig.Measurement.Uncertainty;

namespace SortRig.Measurement.Tests.Uncertainty;

public sealed class DisplayUncertaintyTests
{
    [Fact]
    public void For_TenKilohmOnFiftyKilohmRange_MatchesHandWorkedBudget()
    {
        // Worked by hand. 50 kOhm range of a 50 000-count display: one digit = 50 000 / 50 000 = 1 Ohm.
        // Resolution: half a digit is the half-width a of a rectangular distribution, u = a/√3
        //   (JCGM 100:2008 GUM 4.3.7, eq. (7); F.2.2.1 for the display's resolution): 0.5/1.7320508 = 0.288675 Ohm.
        // Accuracy ±(0.06 % of reading + 4 digits) at 10 003 Ohm (invented spec): a = 6.0018 + 4 = 10.0018 Ohm,
        //   rectangular again (GUM 4.3.7): u = 10.0018/1.7320508 = 5.774542 Ohm.
        // Combined (GUM 5.1.2, uncorrelated): √(5.774542² + 0.288675²) = √(33.345336 + 0.083333) = √33.428669 =
        // 5.781753 Ohm. Transfer (accuracy errors common to the session cancel but for the short-term fraction 0.1):
        //   √(0.083333 + 0.01 × 33.345336) = √0.416786 = 0.645590 Ohm.
        var v = DisplayUncertainty.For(TypedMeter.R50k, 10_003);

        Assert.Equal(0.288675, DisplayUncertainty.Resolution(TypedMeter.R50k), 6);
        Assert.Equal(5.774542, DisplayUncertainty.Accuracy(TypedMeter.R50k, 10_003), 5);
        Assert.Equal(10_003, v.Value);
        Assert.Equal(5.781753, v.StandardUncertainty, 5);
        Assert.Equal(0.645590, v.TransferUncertainty, 5);
        Assert.Equal(2 * 5.781753, v.Expanded, 4); // k = 2 (GUM 6.2.1)
    }

    [Fact]
    public void Resolution_IsHalfADigitOverRootThree_OnEveryRange()
    {
        // GUM 4.3.7: u = a/√3 with a = step/2, so u·√12 = step exactly (textbook identity of the uniform distribution).
        foreach (var range in TypedMeter.Spec.Ranges)
        {
            Assert.Equal(range.Step, DisplayUncertainty.Resolution(range) * Math.Sqrt(12), 9);
        }
    }

    [Fact]
    public void For_NotFinite_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => DisplayUncertainty.For(TypedMeter.R50k, double.NaN));
}
