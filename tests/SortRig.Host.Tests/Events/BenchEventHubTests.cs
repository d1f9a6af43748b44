using Microsoft.Extensions.Time.Testing;
using SortRig.Engine.Events;

namespace SortRig.Host.Tests.Events;

public sealed class BenchEventHubTests
{
    [Fact]
    public async Task Subscribe_WithHistory_GetsEarlierThenLaterEventsInOrder()
    {
        var hub = new BenchEventHub(new FakeTimeProvider());
        hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default, Text: "one"));
        using var cts = new CancellationTokenSource(TimeSpan.FromSeconds(10));
        var seen = new List<BenchEvent>();
        var reader = Task.Run(async () =>
        {
            await foreach (var e in hub.SubscribeAsync(includeHistory: true, cts.Token))
            {
                seen.Add(e);
                if (seen.Count == 3)
                {
                    break;
                }
            }
        });
        while (!reader.IsCompleted && hub.History().Count < 1)
        {
            await Task.Delay(10);
        }

        await Task.Delay(50);
        hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default, Text: "two"));
        hub.Publish(new BenchEvent(0, BenchEventKind.Finished, default));
        await reader;

        Assert.Equal(["one", "two", null], seen.Select(e => e.Text));
        Assert.Equal([1L, 2L, 3L], seen.Select(e => e.Sequence));
    }

    [Fact]
    public void Publish_StampsTimeFromTheInjectedClock()
    {
        var time = new FakeTimeProvider(new DateTimeOffset(2026, 12, 2, 3, 0, 0, TimeSpan.Zero));
        var hub = new BenchEventHub(time);
        time.Advance(TimeSpan.FromSeconds(5));
        var e = hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default));
        Assert.Equal(new DateTimeOffset(2026, 12, 2, 3, 0, 5, TimeSpan.Zero), e.Time);
    }
}
