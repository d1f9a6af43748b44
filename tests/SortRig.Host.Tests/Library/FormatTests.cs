using SortRig.Engine.Parts;
using SortRig.Host.LibraryVerb;
using SortRig.Host.VerbSupport;

namespace SortRig.Host.Tests.Library;

public sealed class FormatTests
{
    [Theory]
    [InlineData("3,4,9", new long[] { 3, 4, 9 })]
    [InlineData("12-15, 3", new long[] { 12, 13, 14, 15, 3 })]
    [InlineData("7,7,6-8", new long[] { 7, 6, 8 })]
    public void PartIds_ParseListsAndRanges(string text, long[] expected) =>
        Assert.Equal(expected, PartIds.Parse(text));

    [Theory]
    [InlineData("")]
    [InlineData("0")]
    [InlineData("-3")]
    [InlineData("5-2")]
    [InlineData("1-200000")]
    [InlineData("abc")]
    public void PartIds_RefuseBadTokens(string text) =>
        Assert.Contains(
            "--ids",
            Assert.Throws<ArgumentException>(() => PartIds.Parse(text)).Message,
            StringComparison.Ordinal
        );
}
