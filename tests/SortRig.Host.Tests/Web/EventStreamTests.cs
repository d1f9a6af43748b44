using System.Text.Json;
using SortRig.Engine.Events;

namespace SortRig.Host.Tests.Web;

/// <summary>/api/events as server-sent events (WHATWG HTML Living Standard, "Server-sent events": id, data,
/// Last-Event-ID).</summary>
public sealed class EventStreamTests
{
    [Fact]
    public async Task Events_ReconnectWithLastEventId_GetsOnlyWhatWasMissed()
    {
        await using var web = await WebHarness.StartAsync();
        for (var i = 1; i <= 3; i++)
        {
            web.Hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default, Text: $"notice {i}"));
        }

        var ids = new List<string>();
        await using (var first = await OpenAsync(web, lastEventId: null))
        {
            for (var i = 0; i < 2; i++)
            {
                ids.Add((await NextEventAsync(first.Reader)).Id);
            }
        }

        await using var again = await OpenAsync(web, lastEventId: ids[1]);
        var (id, data) = await NextEventAsync(again.Reader);

        using var json = JsonDocument.Parse(data);
        Assert.Equal("notice 3", json.RootElement.GetProperty("text").GetString());
        Assert.Equal(3, json.RootElement.GetProperty("sequence").GetInt64());
        Assert.EndsWith(".3", id, StringComparison.Ordinal);
        Assert.Equal(id[..^2], ids[1][..^2]); // the same run
    }

    [Fact]
    public async Task Events_LastEventIdFromAnEarlierRun_GetsTheWholeHistory()
    {
        // After a restart the sequence starts again at 1: an old id must not hide the new run's events.
        await using var web = await WebHarness.StartAsync();
        web.Hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default, Text: "new run"));

        await using var stream = await OpenAsync(web, lastEventId: "0badc0de.900");
        var (_, data) = await NextEventAsync(stream.Reader);

        using var json = JsonDocument.Parse(data);
        Assert.Equal(1, json.RootElement.GetProperty("sequence").GetInt64());
    }

    private sealed record OpenStream(HttpResponseMessage Answer, StreamReader Reader) : IAsyncDisposable
    {
        public ValueTask DisposeAsync()
        {
            Reader.Dispose();
            Answer.Dispose();
            return ValueTask.CompletedTask;
        }
    }

    private static async Task<OpenStream> OpenAsync(WebHarness web, string? lastEventId)
    {
        using var request = new HttpRequestMessage(HttpMethod.Get, "/api/events");
        if (lastEventId is not null)
        {
            request.Headers.Add("Last-Event-ID", lastEventId);
        }

        var answer = await web.Http.SendAsync(request, HttpCompletionOption.ResponseHeadersRead);
        Assert.Equal("text/event-stream", answer.Content.Headers.ContentType?.MediaType);
        return new OpenStream(answer, new StreamReader(await answer.Content.ReadAsStreamAsync()));
    }

    [Fact]
    public async Task Events_OpenStream_DoesNotHoldUpShutdown()
    {
        var web = await WebHarness.StartAsync();
        using var answer = await web.Http.GetAsync("/api/events", HttpCompletionOption.ResponseHeadersRead);
        using var reader = new StreamReader(await answer.Content.ReadAsStreamAsync());
        Assert.StartsWith(":", await reader.ReadLineAsync()); // the opening comment: the stream is live

        // Kestrel would wait its whole shutdown timeout (30 s by default) for a request that never ends.
        await web.DisposeAsync().AsTask().WaitAsync(TimeSpan.FromSeconds(10));
    }

    private static async Task<(string Id, string Data)> NextEventAsync(StreamReader reader)
    {
        string? id = null;
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(10));
        while (await reader.ReadLineAsync(timeout.Token) is { } line)
        {
            if (line.StartsWith("id: ", StringComparison.Ordinal))
            {
                id = line[4..];
            }
            else if (line.StartsWith("data: ", StringComparison.Ordinal))
            {
                return (id ?? "", line[6..]);
            }
        }

        throw new InvalidOperationException("the stream ended before an event");
    }
}
