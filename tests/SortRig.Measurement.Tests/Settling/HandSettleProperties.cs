using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;
using SortRig.Measurement.Readings;
using SortRig.Measurement.Settling;

namespace SortRig.Measurement.Tests.Settling;

/// <summary>Properties of the settle rule for people over generated entry scripts (FsCheck).</summary>
public sealed class HandSettleProperties
{
    [Property(MaxTest = 2000)]
    public void NeverAcceptsBeforeKCountedEntries_AndAcceptedEntriesAgreeWithinOneDigit(PositiveInt seed, byte kByte)
    {
        var k = 2 + (kByte % 4);
        var rng = new Random(seed.Get);
        var settle = new HandSettle(TypedMeter.R50k, new HandSettleOptions { Agreeing = k, MaxEntries = 12 });
        var t = new DateTimeOffset(2026, 1, 1, 0, 0, 0, TimeSpan.Zero);
        DateTimeOffset? lastCounted = null;
        var counted = 0;
        for (var i = 0; i < 30; i++)
        {
            t += TimeSpan.FromSeconds(rng.Next(0, 7));
            var verdict = settle.Add(Reading.Finite(10_000 + rng.Next(0, 4), t, 50_000));
            var tooSoon = lastCounted is { } l && t - l < TimeSpan.FromSeconds(3);
            Assert.Equal(tooSoon, verdict.State == HandSettleState.TooSoon);
            if (!tooSoon)
            {
                counted++;
                lastCounted = t;
            }

            Assert.Equal(counted, verdict.Counted);
            if (verdict.State == HandSettleState.Accepted)
            {
                Assert.True(counted >= k);
                var agreeing = verdict.Entries!.TakeLast(k).Select(e => e.Value).ToArray();
                Assert.True(agreeing.Max() - agreeing.Min() <= 1.0 + 1e-9);
                Assert.InRange(verdict.Value!.Value, agreeing.Min(), agreeing.Max());
                Assert.All(verdict.Entries!.Zip(verdict.Entries!.Skip(1)), p =>
                    Assert.True(p.Second.Time - p.First.Time >= TimeSpan.FromSeconds(3))
                );
                return;
            }

            if (verdict.State == HandSettleState.Unstable)
            {
                Assert.Equal(12, counted);
                return;
            }
        }
    }
}
