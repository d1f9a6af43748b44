using SortRig.Host.Cli;

namespace SortRig.Host.Tests.Cli;

public sealed class TradeValueParserTests
{
    // Multiplier letters R, k, M, G and the letter standing for the decimal point ("4k99"): the resistor
    // letter code of IEC 60062 (from memory); a trailing letter as plain multiplier is common practice, no source.
    [Theory]
    [InlineData("10000", 10_000)]
    [InlineData("10k", 10_000)]
    [InlineData("4.99k", 4_990)]
    [InlineData("4k99", 4_990)]
    [InlineData("1M", 1e6)]
    [InlineData("2M2", 2.2e6)]
    [InlineData("100R", 100)]
    [InlineData("R47", 0.47)]
    [InlineData("1e4", 10_000)]
    public void TryOhms_TradeNotation_ParsesValue(string text, double ohms)
    {
        Assert.True(TradeValueParser.TryOhms(text, out var value));
        Assert.Equal(ohms, value, 9);
    }

    [Theory]
    [InlineData("abc")]
    [InlineData("")]
    [InlineData("0")]
    [InlineData("-10k")]
    [InlineData("4.9k9")]
    [InlineData("10x")]
    public void TryOhms_NotAResistance_Refuses(string text) => Assert.False(TradeValueParser.TryOhms(text, out _));

    // 1 % = 1e-2 and 1 ppm = 1e-6 by definition (SI Brochure, 9th ed., on % and ppm; from memory).
    [Theory]
    [InlineData("0.001", 0.001)]
    [InlineData("0.1%", 0.001)]
    [InlineData("1000ppm", 0.001)]
    [InlineData("50 ppm", 50e-6)]
    [InlineData("1 %", 0.01)]
    public void TryFraction_FractionPercentOrPpm_ParsesFraction(string text, double fraction)
    {
        Assert.True(TradeValueParser.TryFraction(text, out var value));
        Assert.Equal(fraction, value, 12);
    }

    [Theory]
    [InlineData("ten")]
    [InlineData("%")]
    [InlineData("0.1%%")]
    public void TryFraction_NotANumber_Refuses(string text) => Assert.False(TradeValueParser.TryFraction(text, out _));
}
