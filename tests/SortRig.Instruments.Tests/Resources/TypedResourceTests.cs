using SortRig.Instruments.Resources;

namespace SortRig.Instruments.Tests.Resources;

/// <summary>Our TYPED::profile[::INSTR] form (no VISA counterpart: a meter with no link at all).</summary>
public sealed class TypedResourceTests
{
    [Theory]
    [InlineData("TYPED::handheld-typed", "handheld-typed")]
    [InlineData("typed::handheld-typed::INSTR", "handheld-typed")]
    [InlineData("  Typed::my_meter.v2::instr ", "my_meter.v2")]
    public void Parse_TypedResource_NamesTheProfile(string text, string profile)
    {
        var r = Assert.IsType<TypedResource>(ResourceStringParser.Parse(text));
        Assert.Equal(profile, r.Profile);
        Assert.Equal(TransportKind.Typed, r.Transport);
        Assert.True(ResourceStringParser.IsTyped(text));
    }

    [Theory]
    [InlineData("TYPED", 2, "is missing")]
    [InlineData("TYPED1::handheld::INSTR", 1, "board number")]
    [InlineData("TYPED::a b::INSTR", 2, "profile name")]
    [InlineData("TYPED::handheld::extra::INSTR", 3, "unexpected")]
    [InlineData("TYPED::handheld::SOCKET", 3, "only TCPIP")]
    public void Parse_BadTypedResource_NamesThePart(string text, int part, string problem)
    {
        var e = Assert.Throws<ResourceStringException>(() => ResourceStringParser.Parse(text));
        Assert.Equal(part, e.PartNumber);
        Assert.Contains(problem, e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void IsTyped_OtherResources_False()
    {
        Assert.False(ResourceStringParser.IsTyped("TCPIP::127.0.0.1::5025::SOCKET"));
        Assert.False(ResourceStringParser.IsTyped(null));
    }
}
