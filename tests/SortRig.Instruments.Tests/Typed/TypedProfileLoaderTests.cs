using SortRig.Instruments.Profiles;
using SortRig.Instruments.Tests.Support;
using SortRig.Instruments.Typed;

namespace SortRig.Instruments.Tests.Typed;

public sealed class TypedProfileLoaderTests
{
    private static string Shipped => Path.Combine(RepoPaths.Instruments, "typed", "handheld-typed.yaml");

    [Fact]
    public void ShippedProfile_Loads_WithDisplayFigures()
    {
        var spec = TypedProfileLoader.Load(Shipped);

        Assert.Equal("handheld-typed", spec.Family);
        Assert.Equal([500, 5e3, 5e4, 5e5, 5e6, 5e7], spec.Ranges.Select(r => r.FullScale));
        var r50k = spec.Find(50_000)!;
        // 50 000 counts: one digit = 50 000 / 50 000 = 1 Ohm; the display shows up to 49 999 Ohm (arithmetic).
        Assert.Equal(1, r50k.Step, 12);
        Assert.Equal(49_999, r50k.DisplayMax, 9);
        Assert.Equal("49.999 kOhm", r50k.Show(r50k.DisplayMax));
        Assert.Equal("499.99 Ohm", spec.Find(500)!.Show(499.99));
    }

    [Fact]
    public void ShippedProfile_HeaderSaysFiguresAreInvented()
    {
        var header = File.ReadLines(Shipped).TakeWhile(l => l.StartsWith('#')).ToList();
        Assert.Contains(header, l => l.Contains("invented for SortRig", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData(
        "family: x\ncounts: 50000\nranges:\n  - { full_scale: 500, reading_pct: 0.1, digits: 2 }\n  - { full_scale: "
            + "400, reading_pct: 0.1, digits: 2 }\n",
        5,
        "ranges[1].full_scale",
        "ascending"
    )]
    [InlineData(
        "family: x\ncounts: 5\nranges:\n  - { full_scale: 500, reading_pct: 0.1, digits: 2 }\n",
        2,
        "counts",
        "100 to"
    )]
    [InlineData(
        "family: x\ncounts: 50000\nranges:\n  - { full_scale: 500, reading_pct: 0.1, digit: 2 }\n",
        4,
        "ranges[0].digit",
        "unknown key"
    )]
    [InlineData("family: X_Y\ncounts: 50000\nranges: []\n", 1, "family", "not a family name")]
    public void Parse_BadProfile_ErrorNamesLineAndField(string yaml, int line, string field, string words)
    {
        var e = Assert.Throws<ProfileException>(() => TypedProfileLoader.Parse(yaml, "t.yaml"));
        Assert.Equal(line, e.Line);
        Assert.Equal(field, e.Field);
        Assert.Contains(words, e.Message, StringComparison.Ordinal);
    }
}
