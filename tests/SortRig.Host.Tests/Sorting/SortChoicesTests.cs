using System.ComponentModel.DataAnnotations;
using Microsoft.Extensions.Configuration;
using SortRig.Engine.Sorting;

namespace SortRig.Host.Tests.Sorting;

/// <summary>The fixed choices of a session are enums, bound from the same words as before.</summary>
public sealed class SortChoicesTests
{
    [Theory]
    [InlineData("always", "slots", BridgeMode.Always, AssignerKind.Slots)]
    [InlineData("off", "adaptive", BridgeMode.Off, AssignerKind.Adaptive)]
    [InlineData("Auto", "BANDS", BridgeMode.Auto, AssignerKind.Bands)]
    public void Bind_TheWordsOfTheFlags_GiveTheirChoices(
        string bridge,
        string assigner,
        BridgeMode expectedBridge,
        AssignerKind expectedAssigner
    )
    {
        var options = new ConfigurationBuilder()
            .AddInMemoryCollection(
                new Dictionary<string, string?> { ["Sort:Bridge"] = bridge, ["Sort:Assigner"] = assigner }
            )
            .Build()
            .GetSection(SortOptions.Section)
            .Get<SortOptions>()!;

        Assert.Equal(expectedBridge, options.Bridge);
        Assert.Equal(expectedAssigner, options.Assigner);
    }

    [Fact]
    public void Bind_AWordThatIsNoChoice_IsRefusedNamingTheKey()
    {
        var config = new ConfigurationBuilder()
            .AddInMemoryCollection(new Dictionary<string, string?> { ["Sort:Bridge"] = "sometimes" })
            .Build();

        var e = Assert.Throws<InvalidOperationException>(() =>
            config.GetSection(SortOptions.Section).Get<SortOptions>()
        );
        Assert.Contains("Sort:Bridge", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Validate_ANumberOutsideTheChoices_FailsWithTheOptionsMessage()
    {
        var options = new SortOptions { Bridge = (BridgeMode)7, Assigner = (AssignerKind)9 };
        var errors = new List<ValidationResult>();

        Assert.False(
            Validator.TryValidateObject(options, new ValidationContext(options), errors, validateAllProperties: true)
        );
        Assert.Contains(errors, e => e.ErrorMessage == "Sort:Bridge must be auto, always or off.");
        Assert.Contains(errors, e => e.ErrorMessage == "Sort:Assigner must be bands, adaptive or slots.");
    }

    [Theory]
    [InlineData("read:1", nameof(CrashSite.Read), 1)]
    [InlineData("bridged:3", nameof(CrashSite.Bridged), 3)]
    [InlineData("announce:12", nameof(CrashSite.Announce), 12)]
    public void CrashPoint_Parse_ReadsThePointAndCount(string value, string site, int count) =>
        Assert.Equal((Enum.Parse<CrashSite>(site), count), CrashPoint.Parse(value));

    [Theory]
    [InlineData(null)]
    [InlineData("")]
    [InlineData("Read:1")]
    [InlineData("read:0")]
    [InlineData("write:1")]
    [InlineData("read")]
    public void CrashPoint_Parse_UnsetOrMalformed_IsOff(string? value) => Assert.Null(CrashPoint.Parse(value));
}
