using SortRig.Simulator.Scpi;

namespace SortRig.Simulator.Tests.Scpi;

public sealed class MessageParserTests
{
    [Fact]
    public void SplitUnits_IgnoresSeparatorsInsideChannelListsAndQuotes()
    {
        var units = MessageParser.SplitUnits("ROUT:SCAN (@101,103:105);FUNC \"RES;X\";*OPC?");

        Assert.Equal(["ROUT:SCAN (@101,103:105)", "FUNC \"RES;X\"", "*OPC?"], units);
    }

    [Fact]
    public void ParseUnit_SplitsHeaderQueryAndParameters()
    {
        var unit = MessageParser.ParseUnit(":CONF:RES 1000 , MIN");

        Assert.True(unit.Rooted);
        Assert.False(unit.IsQuery);
        Assert.Equal(["CONF", "RES"], unit.Nodes);
        Assert.Equal(["1000", "MIN"], unit.Parameters);
    }

    [Theory]
    [InlineData("RESistance", "RES", true)]
    [InlineData("RESistance", "resistance", true)]
    [InlineData("RESistance", "RESIST", false)]
    [InlineData("NPLCycles", "nplc", true)]
    [InlineData("NPLCycles", "NPL", false)]
    public void Mnemonic_MatchesShortOrLongFormOnly(string mnemonic, string token, bool matches) =>
        Assert.Equal(matches, new Mnemonic(mnemonic).Matches(token));

    [Theory]
    [InlineData("[SENSe]:RESistance:NPLCycles", "RES:NPLC", true)]
    [InlineData("[SENSe]:RESistance:NPLCycles", "SENS:RES:NPLC", true)]
    [InlineData("SYSTem:ERRor:[NEXT]", "SYST:ERR", true)]
    [InlineData("SYSTem:ERRor:[NEXT]", "SYST:ERR:NEXT", true)]
    [InlineData("[SENSe]:RESistance:NPLCycles", "SENS:NPLC", false)]
    public void HeaderPattern_OptionalNodesMayBeLeftOut(string pattern, string header, bool matches) =>
        Assert.Equal(matches, new HeaderPattern(pattern).Matches(header.Split(':')));

    [Theory]
    [InlineData(10_001.2345, "+1.00012345E+04")]
    [InlineData(0.02, "+2.00000000E-02")]
    [InlineData(-1.5, "-1.50000000E+00")]
    [InlineData(9.9e37, "+9.90000000E+37")]
    public void Nr3_FormatsLikeIeee4882(double value, string text) => Assert.Equal(text, Nr3.Format(value));

    [Fact]
    public void ChannelList_ExpandsRanges() => Assert.Equal([101, 103, 104, 105], ChannelList.Parse("(@101,103:105)"));
}
