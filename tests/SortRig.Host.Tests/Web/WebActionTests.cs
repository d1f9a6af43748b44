using System.Net;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;
using SortRig.Engine.Operator;
using SortRig.Host.Web;

namespace SortRig.Host.Tests.Web;

/// <summary>
/// Nothing typed or sent from the page reaches the meter: the only write the page has is one of
/// four fixed operator actions, and anything else is refused before the queue sees it.
/// </summary>
public sealed class WebActionTests
{
    [Fact]
    public async Task Endpoints_TheOnlyWrite_IsTheActionRoute()
    {
        await using var web = await WebHarness.StartAsync();
        var writes = web
            .App.Services.GetRequiredService<EndpointDataSource>()
            .Endpoints.OfType<RouteEndpoint>()
            .Where(e =>
                e.Metadata.GetMetadata<HttpMethodMetadata>()
                    ?.HttpMethods.Any(m => !HttpMethods.IsGet(m) && !HttpMethods.IsHead(m))
                ?? true
            )
            .Select(e => e.RoutePattern.RawText)
            .ToList();

        // The second write is the typed meter's entry line (TypedEndpoints): text for the entry check only.
        Assert.Equal(["/api/actions/{action}", "/api/typed"], writes.Order(StringComparer.Ordinal));
    }

    [Theory]
    [InlineData("undo", OperatorCommand.UndoLast)]
    [InlineData("remeasure", OperatorCommand.Remeasure)]
    [InlineData("pause", OperatorCommand.TogglePause)]
    [InlineData("finish", OperatorCommand.Finish)]
    [InlineData("remeasure-flagged", OperatorCommand.RemeasureFlagged)]
    public async Task PostAction_Known_QueuesExactlyThatCommand(string action, OperatorCommand expected)
    {
        await using var web = await WebHarness.StartAsync();

        using var answer = await web.Http.PostAsync("/api/actions/" + action, null);

        Assert.Equal(HttpStatusCode.Accepted, answer.StatusCode);
        Assert.Equal([expected], web.Queued());
    }

    [Theory]
    [InlineData("/api/actions/reboot")]
    [InlineData("/api/actions/UNDO")]
    [InlineData("/api/actions/undo%20now")]
    [InlineData("/api/actions/%3AMEAS%3ARES%3F")] // ":MEAS:RES?", an SCPI query, is just an unknown name
    [InlineData("/api/actions/*RST")]
    public async Task PostAction_Unknown_Returns400AndQueuesNothing(string path)
    {
        await using var web = await WebHarness.StartAsync();

        using var answer = await web.Http.PostAsync(path, new StringContent("*RST;:SYST:REM"));

        Assert.Equal(HttpStatusCode.BadRequest, answer.StatusCode);
        Assert.Contains(
            "undo, remeasure, pause, finish",
            await answer.Content.ReadAsStringAsync(),
            StringComparison.Ordinal
        );
        Assert.Empty(web.Queued());
    }

    [Theory]
    [InlineData("PUT")]
    [InlineData("DELETE")]
    public async Task OtherMethods_OnTheActionRoute_QueueNothing(string method)
    {
        await using var web = await WebHarness.StartAsync();

        using var answer = await web.Http.SendAsync(
            new HttpRequestMessage(new HttpMethod(method), "/api/actions/undo")
        );

        Assert.Equal(HttpStatusCode.MethodNotAllowed, answer.StatusCode);
        Assert.Empty(web.Queued());
    }

    [Fact]
    public async Task PostAction_FromAnotherSite_IsRefusedAndQueuesNothing()
    {
        await using var web = await WebHarness.StartAsync();
        using var foreign = new HttpRequestMessage(HttpMethod.Post, "/api/actions/finish");
        foreign.Headers.Add("Origin", "http://bench-helper.example");
        using var same = new HttpRequestMessage(HttpMethod.Post, "/api/actions/finish");
        same.Headers.Add("Origin", web.BaseUrl);

        using var refused = await web.Http.SendAsync(foreign);
        Assert.Equal(HttpStatusCode.Forbidden, refused.StatusCode);
        Assert.Empty(web.Queued());

        using var accepted = await web.Http.SendAsync(same);
        Assert.Equal(HttpStatusCode.Accepted, accepted.StatusCode);
        Assert.Equal([OperatorCommand.Finish], web.Queued());
    }

    [Fact]
    public async Task Request_WithAForeignHostName_IsRefusedOnALoopbackBind()
    {
        // A page elsewhere could make its own name resolve to 127.0.0.1 (DNS rebinding); the
        // browser then sends that name as Host.
        await using var web = await WebHarness.StartAsync();
        using var request = new HttpRequestMessage(HttpMethod.Get, "/api/cups");
        request.Headers.Host = "rebound.example";

        using var answer = await web.Http.SendAsync(request);

        Assert.Equal(HttpStatusCode.Forbidden, answer.StatusCode);
        using var local = await web.Http.GetAsync("/api/cups");
        Assert.Equal(HttpStatusCode.OK, local.StatusCode);
    }
}
