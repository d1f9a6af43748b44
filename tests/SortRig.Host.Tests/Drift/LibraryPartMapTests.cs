using Microsoft.Extensions.Configuration;
using SortRig.Engine.DriftLogging;

namespace SortRig.Host.Tests.Drift;

/// <summary>The channel=part notation of --library-parts / Drift:LibraryParts (our own notation; no outside
/// source).</summary>
public sealed class LibraryPartMapTests
{
    private static readonly int[] s_scan = [101, 102, 103, 104];

    [Fact]
    public void Parse_SinglesLabelsAndRanges_MapEachChannelToItsPart()
    {
        var map = LibraryPartMap.Parse(" 101=17, 102=#18 ,103-104=#20-#21", s_scan);

        Assert.Equal(
            new Dictionary<int, long>
            {
                [101] = 17,
                [102] = 18,
                [103] = 20,
                [104] = 21,
            },
            map
        );
    }

    [Fact]
    public void Parse_DescendingChannelRange_TakesThePartsInOrder()
    {
        var map = LibraryPartMap.Parse("104-102=7-9", s_scan);

        Assert.Equal(
            new Dictionary<int, long>
            {
                [104] = 7,
                [103] = 8,
                [102] = 9,
            },
            map
        );
    }

    [Theory]
    [InlineData(null)]
    [InlineData("")]
    [InlineData("  ")]
    public void Parse_Nothing_MapsNoChannel(string? text) => Assert.Empty(LibraryPartMap.Parse(text, s_scan));

    [Theory]
    [InlineData("105=17", "item '105=17'", "channel 105 is not in the scan list (101,102,103,104)")]
    [InlineData("101=17,103=17", "item '103=17'", "part 17 is already on channel 101")]
    [InlineData("101=17,101=18", "item '101=18'", "channel 101 already has part 17")]
    [InlineData("101-103=17-18", "item '101-103=17-18'", "names 3 channel(s) but 2 part(s)")]
    [InlineData("101", "item '101'", "must be channel=part")]
    [InlineData("101=x", "item '101=x'", "'x' is not a part id")]
    [InlineData("101=0", "item '101=0'", "'0' is not a part id")]
    [InlineData("abc=17", "item 'abc=17'", "'abc' is not a channel")]
    public void Parse_Bad_NamesTheOptionTheItemAndWhy(string text, string item, string why)
    {
        var e = Assert.Throws<ArgumentException>(() => LibraryPartMap.Parse(text, s_scan));

        Assert.StartsWith("Drift.LibraryParts (--library-parts): ", e.Message, StringComparison.Ordinal);
        Assert.Contains(item, e.Message, StringComparison.Ordinal);
        Assert.Contains(why, e.Message, StringComparison.Ordinal);
        Assert.Equal(LibraryPartMap.Key, e.ParamName);
    }

    [Fact]
    public void Validate_MappingOutsideTheChannels_IsRefusedLikeTheOtherOptions()
    {
        var e = Assert.Throws<ArgumentException>(() =>
            new DriftOptions { Channels = "101-102", LibraryParts = "103=5" }.Validate()
        );

        Assert.Equal(LibraryPartMap.Key, e.ParamName);
    }

    [Fact]
    public void Configuration_DriftSectionInAJsonFile_BindsTheMappingAsTheVerbDoes()
    {
        var file = Path.Combine(Directory.CreateTempSubdirectory("sortrig-drift-config-").FullName, "appsettings.json");
        File.WriteAllText(file, """{ "Drift": { "Channels": "101-103", "LibraryParts": "101=12,102-103=#14-#15" } }""");
        try
        {
            // The same binding as the drift verb and its worker: the "Drift" section into DriftOptions.
            var options = new ConfigurationBuilder()
                .AddJsonFile(file)
                .Build()
                .GetSection(DriftOptions.Section)
                .Get<DriftOptions>()!;

            Assert.Equal(
                new Dictionary<int, long>
                {
                    [101] = 12,
                    [102] = 14,
                    [103] = 15,
                },
                options.Validate().LibraryParts
            );
        }
        finally
        {
            Directory.Delete(Path.GetDirectoryName(file)!, recursive: true);
        }
    }
}
