using SortRig.Instruments.Profiles;

namespace SortRig.Instruments.Tests.Profiles;

/// <summary>Hostile profile files are refused before parsing, with file:line:col, and the process survives.</summary>
public sealed class ProfileLimitsTests
{
    [Fact]
    public void Parse_NestedDeeperThanTheLimit_RefusedWhereItCrossesIt_NoStackOverflow()
    {
        // 40 000 nested flow maps (under the size limit): YamlDotNet's document model would recurse once per level.
        var yaml = "family: " + string.Concat(Enumerable.Repeat("{a: ", 40_000)) + "1" + new string('}', 40_000) + "\n";
        var e = Assert.Throws<ProfileException>(() => MeterProfileLoader.Parse(yaml, "deep.yaml"));
        Assert.Equal(1, e.Line);
        // Level 1 is the root map; level 17 is the 16th "{a: " (4 characters each) after "family: " (8 characters).
        Assert.Equal("family: ".Length + (4 * (ProfileLimits.MaxDepth - 1)) + 1, e.Column);
        Assert.Contains("nests more than 16 levels", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Load_DeviceThatNeverEnds_RefusedAsNotARegularFile()
    {
        var e = Assert.Throws<ProfileException>(() => MeterProfileLoader.Load("/dev/zero"));
        Assert.Equal((1, 1), (e.Line, e.Column));
        Assert.Contains("is not a regular file", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Parse_TextOverTheSizeLimit_Refused()
    {
        var yaml = "family: x\n# " + new string('x', ProfileLimits.MaxBytes) + "\n";
        var e = Assert.Throws<ProfileException>(() => MeterProfileLoader.Parse(yaml, "big.yaml"));
        Assert.Contains($"is over {ProfileLimits.MaxBytes} bytes", e.Message, StringComparison.Ordinal);
    }
}
