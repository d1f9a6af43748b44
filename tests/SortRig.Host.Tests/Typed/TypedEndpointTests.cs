using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using SortRig.Engine.Typed;
using SortRig.Host.Tests.Web;

namespace SortRig.Host.Tests.Typed;

/// <summary>POST /api/typed: a line for the typed meter's entry check, and nothing else.</summary>
public sealed class TypedEndpointTests
{
    [Fact]
    public async Task Post_NoTypedSession_404_NothingQueued()
    {
        await using var web = await WebHarness.StartAsync();

        using var answer = await web.Http.PostAsJsonAsync("/api/typed", new { line = "10.003" });

        Assert.Equal(HttpStatusCode.NotFound, answer.StatusCode);
        var prompt = JsonDocument.Parse(await web.Http.GetStringAsync("/api/typed")).RootElement;
        Assert.False(prompt.GetProperty("active").GetBoolean());
    }

    [Fact]
    public async Task Post_WhileAsked_QueuesTheLine_AndGetShowsThePrompt()
    {
        var entries = new TypedEntries();
        await using var web = await WebHarness.StartAsync(typed: entries);
        var asked = entries.AskAsync("part 1: type the display", CancellationToken.None).AsTask();

        var prompt = JsonDocument.Parse(await web.Http.GetStringAsync("/api/typed")).RootElement;
        using var answer = await web.Http.PostAsJsonAsync("/api/typed", new { line = "10k003" });

        Assert.True(prompt.GetProperty("active").GetBoolean());
        Assert.Equal("part 1: type the display", prompt.GetProperty("prompt").GetString());
        Assert.Equal(HttpStatusCode.Accepted, answer.StatusCode);
        Assert.Equal("10k003", await asked.WaitAsync(TimeSpan.FromSeconds(5)));
    }

    [Theory]
    [InlineData("10.003\n10.004")]
    [InlineData("12345678901234567890123456789012345678901")] // 41 characters
    public async Task Post_OverlongOrControlCharacters_400_NothingQueued(string line)
    {
        var entries = new TypedEntries();
        await using var web = await WebHarness.StartAsync(typed: entries);
        var asked = entries.AskAsync("part 1: type the display", CancellationToken.None).AsTask();

        using var answer = await web.Http.PostAsJsonAsync("/api/typed", new { line });

        Assert.Equal(HttpStatusCode.BadRequest, answer.StatusCode);
        await Task.Delay(200);
        Assert.False(asked.IsCompleted);
    }

    [Fact]
    public async Task Post_FromAnotherSite_Refused()
    {
        var entries = new TypedEntries();
        await using var web = await WebHarness.StartAsync(typed: entries);
        var asked = entries.AskAsync("part 1: type the display", CancellationToken.None).AsTask();
        using var request = new HttpRequestMessage(HttpMethod.Post, "/api/typed")
        {
            Content = JsonContent.Create(new { line = "10.003" }),
        };
        request.Headers.Add("Origin", "http://evil.example");

        using var answer = await web.Http.SendAsync(request);

        Assert.Equal(HttpStatusCode.Forbidden, answer.StatusCode);
        await Task.Delay(200);
        Assert.False(asked.IsCompleted);
    }
}
