using SortRig.Engine.Sorting;

namespace SortRig.Engine.Tests.Sorting;

public sealed class SortPaceTests
{
    private static readonly DateTimeOffset T0 = new(2026, 3, 2, 8, 0, 0, TimeSpan.Zero);

    [Fact]
    public void From_FivePartsTenSecondsApartInAnyOrder_TenSecondsPerPart360PerHour()
    {
        // Arithmetic (common practice, no source): 5 acceptances over 40 s are 4 intervals of 10 s; 3600 / 10 = 360.
        var pace = SortPace.From([T0.AddSeconds(20), T0, T0.AddSeconds(40), T0.AddSeconds(10), T0.AddSeconds(30)]);

        Assert.Equal(5, pace.Parts);
        Assert.Equal(TimeSpan.FromSeconds(40), pace.Span);
        Assert.Equal(10, pace.SecondsPerPart!.Value, 12);
        Assert.Equal(360, pace.PartsPerHour!.Value, 9);
    }

    [Fact]
    public void From_UnevenGaps_MeanIntervalFromFirstToLast()
    {
        // 3 acceptances at 0, 2.5 and 12.5 s: (12.5 - 0) / 2 = 6.25 s per part; 3600 / 6.25 = 576 per hour
        // (arithmetic).
        var pace = SortPace.From([T0, T0.AddSeconds(2.5), T0.AddSeconds(12.5)]);

        Assert.Equal(6.25, pace.SecondsPerPart!.Value, 12);
        Assert.Equal(576, pace.PartsPerHour!.Value, 9);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    public void From_FewerThanTwoParts_NoPace(int parts)
    {
        var pace = SortPace.From(Enumerable.Repeat(T0, parts));

        Assert.Equal(parts, pace.Parts);
        Assert.Null(pace.SecondsPerPart);
        Assert.Null(pace.PartsPerHour);
    }
}
