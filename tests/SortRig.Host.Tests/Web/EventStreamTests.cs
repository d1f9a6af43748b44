using System.Text.Json;
using SortRig.Host.Events;

namespace SortRig.Host.Tests.Web;

/// <summary>/api/events as server-sent events (WHATWG HTML Living Standard, "Server-sent events": id, data, Last-Event-ID).</summary>
public sealed class EventStreamTests
{
    [Fact]
    public async Task Events_WithLastEventId_SendOnlyWhatWasMissed()
    {
        await using var web = await WebHarness.StartAsync();
        for (var i = 1; i <= 3; i++)
        {
            web.Hub.Publish(new BenchEvent(0, BenchEventKind.Notice, default, Text: $"notice {i}"));
        }

        using var request = new HttpRequestMessage(HttpMethod.Get, "/api/events");
        request.Headers.Add("Last-Event-ID", "2");
        using var answer = await web.Http.SendAsync(request, HttpCompletionOption.ResponseHeadersRead);
        Assert.Equal("text/event-stream", answer.Content.Headers.ContentType?.MediaType);
        using var reader = new StreamReader(await answer.Content.ReadAsStreamAsync());

        var (id, data) = await NextEventAsync(reader);

        Assert.Equal("3", id);
        using var json = JsonDocument.Parse(data);
        Assert.Equal("Notice", json.RootElement.GetProperty("kind").GetString());
        Assert.Equal("notice 3", json.RootElement.GetProperty("text").GetString());
        Assert.Equal(3, json.RootElement.GetProperty("sequence").GetInt64());
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
