using Microsoft.Extensions.Time.Testing;
using SortRig.Engine.Events;

namespace SortRig.Engine.Tests.Events;

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

    [Fact]
    public async Task SlowSubscriber_LosesOnlyOldLiveReadings_NeverAnAnnouncementOrTheEnd()
    {
        var hub = new BenchEventHub(new FakeTimeProvider());
        using var cts = new CancellationTokenSource(TimeSpan.FromSeconds(30));
        await using var events = hub.SubscribeAsync(includeHistory: false, cts.Token).GetAsyncEnumerator(cts.Token);
        var first = events.MoveNextAsync(); // subscribes, then waits
        while (!first.IsCompleted)
        {
            hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default, Text: "start"));
            await Task.Delay(5);
        }

        // A reader that does not read while 20 000 readings and 100 announcements arrive (a terminal that blocks).
        for (var i = 0; i < 20_000; i++)
        {
            hub.Publish(new BenchEvent(0, BenchEventKind.Reading, default, Value: i));
            if (i % 200 == 199)
            {
                hub.Publish(
                    new BenchEvent(0, BenchEventKind.Announcement, default, PartNumber: (i + 1) / 200, Cup: "A")
                );
            }
        }

        hub.Publish(new BenchEvent(0, BenchEventKind.Finished, default));
        var seen = new List<BenchEvent>();
        while (await events.MoveNextAsync() && events.Current.Kind != BenchEventKind.Finished)
        {
            seen.Add(events.Current);
        }

        var announced = seen.Where(e => e.Kind == BenchEventKind.Announcement).Select(e => e.PartNumber ?? -1).ToList();
        Assert.Equal(Enumerable.Range(1, 100).Select(n => (long)n), announced); // every one, in order
        var readings = seen.Where(e => e.Kind == BenchEventKind.Reading).Select(e => e.Value ?? -1).ToList();
        Assert.InRange(readings.Count, 1, 4096);
        Assert.Equal(19_999, readings[^1]); // the newest reading is kept; the oldest went
        Assert.Equal(readings.Order(), readings);
        Assert.True(seen.Select(e => e.Sequence).SequenceEqual(seen.Select(e => e.Sequence).Order()), "out of order");
    }
}
