using SortRig.Engine.Parts;
using SortRig.Host.LibraryVerb;
using SortRig.Host.VerbSupport;

namespace SortRig.Host.Tests.Library;

public sealed class FormatTests
{
    [Theory]
    // JCGM 100:2008 sec. 7.2.2 example: m = 100.021 47 g with u = 0.35 mg is quoted to the same (fifth) decimal.
    [InlineData(100.02147, 0.00035, "100.02147", "0.00035")]
    // Two significant digits of U, value to the same place (JCGM 100:2008 sec. 7.2.6); figures invented.
    [InlineData(9999.87312, 0.02412, "9999.873", "0.024")]
    [InlineData(10_043.795, 1.2805, "10043.8", "1.3")]
    [InlineData(1_000_123.4, 240, "1000123", "240")]
    // 0.0996 rounds to 0.100 at three decimals: one fewer keeps two significant digits.
    [InlineData(20_000.12345, 0.0996, "20000.12", "0.10")]
    public void WithUncertainty_RoundsUToTwoDigitsAndTheValueAlike(double value, double u, string expectedValue, string expectedU)
    {
        Assert.Equal((expectedValue, expectedU), Format.WithUncertainty(value, u));
    }

    [Theory]
    [InlineData("3,4,9", new long[] { 3, 4, 9 })]
    [InlineData("12-15, 3", new long[] { 12, 13, 14, 15, 3 })]
    [InlineData("7,7,6-8", new long[] { 7, 6, 8 })]
    public void PartIds_ParseListsAndRanges(string text, long[] expected) => Assert.Equal(expected, PartIds.Parse(text));

    [Theory]
    [InlineData("")]
    [InlineData("0")]
    [InlineData("-3")]
    [InlineData("5-2")]
    [InlineData("1-200000")]
    [InlineData("abc")]
    public void PartIds_RefuseBadTokens(string text) =>
        Assert.Contains("--ids", Assert.Throws<ArgumentException>(() => PartIds.Parse(text)).Message, StringComparison.Ordinal);
}
