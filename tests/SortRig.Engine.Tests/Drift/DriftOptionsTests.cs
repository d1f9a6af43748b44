using SortRig.Engine.DriftLogging;

namespace SortRig.Engine.Tests.Drift;

public sealed class DriftOptionsTests
{
    [Fact]
    public void Validate_Defaults_TwelveHoursEveryMinuteWithPt100BracketingTheParts()
    {
        var s = new DriftOptions().Validate();

        Assert.Null(s.Resource);
        Assert.Equal([101, 102, 103, 104], s.Channels);
        Assert.Equal(TimeSpan.FromSeconds(60), s.Interval);
        Assert.Equal(TimeSpan.FromHours(12), s.Duration);
        Assert.Equal([105, 101, 102, 103, 104, 105], s.ScanOrder);
        Assert.Equal(64, s.BatchSize);
    }

    [Fact]
    public void Validate_DefaultPt100_IsTheChannelAfterTheHighestPartChannel()
    {
        // Our own default layout: parts first, the Pt100 on the next channel.
        Assert.Equal(
            113,
            new DriftOptions { Channels = "101-112" }
                .Validate()
                .Pt100Channel
        );
        Assert.Equal(
            108,
            new DriftOptions { Channels = "107,101-103" }
                .Validate()
                .Pt100Channel
        );
    }

    [Theory]
    [InlineData("night\nERROR forged line", null, "Drift.Run", "U+000A")]
    [InlineData("overnight", "rack 2\u001b]0;owned\u0007", "Drift.Notes", "U+001B")]
    public void Validate_ControlCharacterInRunOrNotes_RefusedNamingTheOptionAndTheCharacter(
        string run,
        string? notes,
        string option,
        string shown
    )
    {
        var e = Assert.Throws<ArgumentException>(() => new DriftOptions { Run = run, Notes = notes }.Validate());

        Assert.StartsWith(
            option + " must be plain text without control characters",
            e.Message,
            StringComparison.Ordinal
        );
        Assert.Contains(shown, e.Message, StringComparison.Ordinal);
        Assert.DoesNotContain(e.Message, char.IsControl);
    }

    [Fact]
    public void Validate_DeviceAsDatabase_Refused() =>
        Assert.Contains(
            "is a device",
            Assert.Throws<ArgumentException>(() => new DriftOptions { Database = "/dev/null" }.Validate()).Message,
            StringComparison.Ordinal
        );

    [Fact]
    public void Validate_ZeroHoursAndNoPt100_LogsUntilStoppedWithoutThermometer()
    {
        var s = new DriftOptions
        {
            Hours = 0,
            Pt100Channel = 0,
            Channels = "105",
        }.Validate();

        Assert.Null(s.Duration);
        Assert.Null(s.Pt100Channel);
        Assert.Equal([105], s.ScanOrder);
    }

    [Theory]
    [InlineData(nameof(DriftOptions.IntervalSeconds), "Drift.IntervalSeconds")]
    [InlineData(nameof(DriftOptions.Hours), "Drift.Hours")]
    [InlineData(nameof(DriftOptions.BatchSize), "Drift.BatchSize")]
    [InlineData(nameof(DriftOptions.Pt100Channel), "Drift.Pt100Channel")]
    [InlineData(nameof(DriftOptions.Speed), "Drift.Speed")]
    public void Validate_OutOfRange_NamesTheOptionAndItsRange(string option, string name)
    {
        var o = new DriftOptions();
        switch (option)
        {
            case nameof(DriftOptions.IntervalSeconds):
                o.IntervalSeconds = 0.5;
                break;
            case nameof(DriftOptions.Hours):
                o.Hours = -1;
                break;
            case nameof(DriftOptions.BatchSize):
                o.BatchSize = 0;
                break;
            case nameof(DriftOptions.Pt100Channel):
                o.Pt100Channel = 102;
                break; // a part channel
            default:
                o.Speed = 20_000;
                break;
        }

        var e = Assert.Throws<ArgumentException>(() => o.Validate());
        Assert.Equal(name, e.ParamName);
        Assert.Contains(" to ", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Validate_SpeedWithARealMeter_IsRefused()
    {
        var e = Assert.Throws<ArgumentException>(() =>
            new DriftOptions { Resource = "TCPIP::127.0.0.1::5025::SOCKET", Speed = 60 }.Validate()
        );

        Assert.Contains("simulator only", e.Message, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData("101-104,107", new[] { 101, 102, 103, 104, 107 })]
    [InlineData(" 110 - 108 ", new[] { 110, 109, 108 })]
    [InlineData("1", new[] { 1 })]
    public void ChannelList_Parses_RangesAndSingles(string text, int[] expected) =>
        Assert.Equal(expected, ChannelListParser.Parse(text, "Drift.Channels"));

    [Theory]
    [InlineData("", "empty")]
    [InlineData("101,,102", "item ''")]
    [InlineData("101-x", "'x'")]
    [InlineData("0", "'0'")]
    [InlineData("101,101", "appears twice")]
    [InlineData("1-65", "more than 64")]
    public void ChannelList_Bad_SaysWhatIsWrong(string text, string said)
    {
        var e = Assert.Throws<ArgumentException>(() => ChannelListParser.Parse(text, "Drift.Channels"));

        Assert.Contains(said, e.Message, StringComparison.Ordinal);
        Assert.Equal("Drift.Channels", e.ParamName);
    }
}
