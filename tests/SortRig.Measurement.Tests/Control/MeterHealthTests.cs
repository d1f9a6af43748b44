using SortRig.Measurement.Control;

namespace SortRig.Measurement.Tests.Control;

/// <summary>
/// A meter's accuracy stated as "% of reading + % of range" and the movement of a meter's gain judged against it:
/// common practice, no source. The figures are our own invented ones, worked by hand in the comments.
/// </summary>
public sealed class MeterHealthTests
{
    private static readonly DateTimeOffset s_t0 = new(2026, 3, 2, 8, 0, 0, TimeSpan.Zero);

    [Fact]
    public void AllowedPpm_ReadingPlusRangeTermAtTheValue()
    {
        // 0.0095 % of reading + 0.0006 % of the 100 kOhm range at 10 kOhm:
        // (0.0095 + 0.0006 * 100 000 / 10 000) % = (0.0095 + 0.006) % = 0.0155 % = 155 ppm (1 % = 10 000 ppm).
        Assert.Equal(155, MeterHealth.AllowedPpm(0.0095, 0.0006, 100_000, 10_000), 9);
    }

    [Fact]
    public void Judge_WarnsOnlyWhenMovedBeyondAllowance_FromTheFirstSessionInTimeOrder()
    {
        var rows = MeterHealth.Judge(
            [
                new SessionGain("c", s_t0.AddDays(60), -30, 4),
                new SessionGain("a", s_t0, 10, 6),
                new SessionGain("b", s_t0.AddDays(30), 40, 5),
            ],
            allowedPpm: 35
        );

        Assert.Equal(["a", "b", "c"], rows.Select(r => r.Gain.Session));
        Assert.Equal([0.0, 30.0, -40.0], rows.Select(r => r.MovedPpm));
        Assert.Null(rows[0].Warning);
        Assert.Null(rows[1].Warning); // 30 <= 35
        Assert.Contains("-40.0 ppm since a", rows[2].Warning, StringComparison.Ordinal);
    }

    [Fact]
    public void Judge_Empty_NoRows() => Assert.Empty(MeterHealth.Judge([], 10));
}
