using SortRig.Engine.Typed;
using SortRig.Measurement.Specs;

namespace SortRig.Engine.Tests.Typed;

/// <summary>
/// Checks on each value typed off the display. Ranges of the invented hand-held (instruments/typed/handheld-typed.yaml,
/// figures invented for SortRig): 50 000 counts, so the 50 kOhm range shows 0.000 to 49.999 kOhm and the 500 Ohm range
/// 0.00 to 499.99 Ohm.
/// </summary>
public sealed class EntryCheckTests
{
    private static readonly DisplayRange s_r50k = new(50_000, 50_000, 0.06, 4);
    private static readonly DisplayRange s_r500 = new(500, 50_000, 0.09, 6);

    [Theory]
    [InlineData("10.003", 10_003)] // bare number: the display's unit on this range (kOhm)
    [InlineData(" 10.003 ", 10_003)]
    [InlineData("10.003k", 10_003)] // trade notation with a multiplier
    [InlineData("10k003", 10_003)] // the letter as the decimal marker (IEC 60062 RKM code)
    [InlineData("10.003 kOhm", 10_003)]
    [InlineData("10003R", 10_003)]
    [InlineData("10k", 10_000)]
    [InlineData("9.95", 9_950)] // fewer digits than shown: taken as written
    public void Check_ValidEntry_PassesWithOhms(string text, double ohms)
    {
        var v = EntryCheck.Check(text, s_r50k, 10_000);
        Assert.True(v.Passed, v.Problem);
        Assert.Equal(ohms, v.Ohms, 9);
    }

    [Theory]
    [InlineData("", "nothing typed")]
    [InlineData("10..003", "two decimal points")]
    [InlineData("10.0.03", "two decimal points")]
    [InlineData("10k0.03", "two decimal points")]
    [InlineData("1o.003", "letters or signs")]
    [InlineData("10.003x", "letters or signs")]
    [InlineData("-10.003", "letters or signs")]
    [InlineData("10kk", "letters or signs")]
    [InlineData("10.0031", "more digits than the 50 kOhm range shows")]
    [InlineData("50.000", "above what the 50 kOhm range shows (49.999 kOhm)")]
    [InlineData("100.03", "above what the 50 kOhm range shows")]
    [InlineData("1.000", "10 times below the nominal 10 kOhm")]
    [InlineData("0", "is zero")]
    [InlineData(".", "is not a number")]
    public void Check_BadEntry_RefusedWithAPromptToReEnter(string text, string words)
    {
        var v = EntryCheck.Check(text, s_r50k, 10_000);
        Assert.False(v.Passed);
        Assert.True(double.IsNaN(v.Ohms));
        Assert.Contains(words, v.Problem, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_TenTimesAboveNominal_OnARangeThatShowsIt_Refused()
    {
        // 100 Ohm parts on the 500 Ohm range: "330.00" would fit the display but is 3.3× the nominal, past √10 = 3.16.
        var v = EntryCheck.Check("330.00", s_r500, 100);
        Assert.Contains("3.3 times above the nominal 100 Ohm", v.Problem, StringComparison.Ordinal);
        Assert.True(EntryCheck.Check("100.02", s_r500, 100).Passed);
    }

    [Fact]
    public void Check_OhmRange_BareNumberIsOhms()
    {
        var v = EntryCheck.Check("99.87", s_r500, 100);
        Assert.Equal(99.87, v.Ohms, 9);
    }
}
