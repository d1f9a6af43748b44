using System.Net;
using System.Net.Http.Headers;
using System.Net.Sockets;
using System.Security.Cryptography;
using SortRig.Host.Cli;
using SortRig.Host.Web;

namespace SortRig.Host.Tests.Web;

/// <summary>
/// The page off loopback: the sort verb refuses to start without a token, and with one every
/// request without it is refused, while the token itself never reaches the log.
/// </summary>
[Collection(WebSortCollection.Name)]
public sealed class WebTokenTests
{
    [Fact]
    public async Task SortVerb_NonLoopbackBindWithoutToken_FailsBeforeListening()
    {
        var dir = Directory.CreateTempSubdirectory("sortrig-web-refuse-").FullName;
        try
        {
            var port = TestPorts.Free(anyAddress: true);
            var url = $"http://0.0.0.0:{port}";
            var flags = new Dictionary<string, string?>
            {
                ["Sort:Database"] = Path.Combine(dir, "refused.db"),
                ["Sort:Live"] = "True",
                ["Sort:Speech"] = "True",
                ["Web:Enabled"] = "true",
                ["Web:Urls"] = url,
                ["Logging:File"] = Path.Combine(dir, "logs", "sortrig-.log"),
            };

            var e = await Assert.ThrowsAsync<InvalidOperationException>(() =>
                SortCommand.RunAsync(flags, CancellationToken.None)
            );

            Assert.Contains(url, e.Message, StringComparison.Ordinal);
            Assert.Contains("Web:Token", e.Message, StringComparison.Ordinal);
            Assert.False(File.Exists(Path.Combine(dir, "refused.db")), "no session may start");
            using var client = new TcpClient();
            await Assert.ThrowsAnyAsync<SocketException>(() => client.ConnectAsync(IPAddress.Loopback, port));
        }
        finally
        {
            Directory.Delete(dir, recursive: true);
        }
    }

    [Fact]
    public async Task SortVerb_WithToken_RefusesEveryRequestWithoutIt_AndNeverLogsIt()
    {
        var token = Convert.ToHexString(RandomNumberGenerator.GetBytes(16));
        // Every level on, Microsoft's included: the request-line logger would print ?token= if it were let through.
        var verbose = new Dictionary<string, string?>
        {
            ["Serilog:MinimumLevel:Default"] = "Verbose",
            ["Serilog:MinimumLevel:Override:Microsoft"] = "Verbose",
            ["Serilog:MinimumLevel:Override:System"] = "Verbose",
        };
        await using var run = await WebSortRun.StartAsync(parts: 2, speed: 10, token, anyAddress: true, verbose);
        using var bare = new HttpClient(new HttpClientHandler { AllowAutoRedirect = false, UseCookies = false })
        {
            BaseAddress = new Uri(run.BaseUrl),
        };

        foreach (
            var path in new[]
            {
                "/",
                "/app.js",
                "/api/session",
                "/api/parts",
                "/api/cups",
                "/api/events",
                "/api/events/recent",
            }
        )
        {
            using var answer = await bare.GetAsync(path, HttpCompletionOption.ResponseHeadersRead);
            Assert.True(
                answer.StatusCode == HttpStatusCode.Unauthorized,
                $"GET {path} without the token: {answer.StatusCode}"
            );
        }

        using (var post = await bare.PostAsync("/api/actions/undo", null))
        {
            Assert.Equal(HttpStatusCode.Unauthorized, post.StatusCode);
        }

        using (var wrong = new HttpRequestMessage(HttpMethod.Get, "/api/cups"))
        {
            wrong.Headers.Authorization = new AuthenticationHeaderValue(
                "Bearer",
                token[..^1] + (token[^1] == '0' ? "1" : "0")
            );
            using var answer = await bare.SendAsync(wrong);
            Assert.Equal(HttpStatusCode.Unauthorized, answer.StatusCode);
        }

        using var bearer = new HttpClient { BaseAddress = new Uri(run.BaseUrl) };
        bearer.DefaultRequestHeaders.Authorization = new AuthenticationHeaderValue("Bearer", token);
        foreach (var path in new[] { "/", "/app.js", "/api/session", "/api/parts", "/api/cups", "/api/events/recent" })
        {
            using var answer = await bearer.GetAsync(path);
            Assert.True(answer.StatusCode == HttpStatusCode.OK, $"GET {path} with the token: {answer.StatusCode}");
        }

        using (var events = await bearer.GetAsync("/api/events", HttpCompletionOption.ResponseHeadersRead))
        {
            Assert.Equal(HttpStatusCode.OK, events.StatusCode);
            Assert.Equal("text/event-stream", events.Content.Headers.ContentType?.MediaType);
        }

        using (var post = await bearer.PostAsync("/api/actions/pause", null))
        {
            Assert.Equal(HttpStatusCode.Accepted, post.StatusCode);
        }

        // ?token= on the page URL: a cookie, and a redirect to the bare URL.
        using var once = await bare.GetAsync("/?token=" + token);
        Assert.Equal(HttpStatusCode.Redirect, once.StatusCode);
        Assert.Equal("/", once.Headers.Location?.OriginalString);
        var cookie = Assert.Single(once.Headers.GetValues("Set-Cookie"));
        Assert.StartsWith(TokenGate.CookieName + "=" + token + ";", cookie, StringComparison.Ordinal);
        Assert.Contains("httponly", cookie, StringComparison.OrdinalIgnoreCase);
        Assert.Contains("samesite=strict", cookie, StringComparison.OrdinalIgnoreCase);
        using (var withCookie = new HttpRequestMessage(HttpMethod.Get, "/api/session"))
        {
            withCookie.Headers.Add("Cookie", cookie.Split(';')[0]);
            using var answer = await bare.SendAsync(withCookie);
            Assert.Equal(HttpStatusCode.OK, answer.StatusCode);
        }

        await run.StopAsync();
        var logged = run.LogText();
        // the log was captured, Microsoft's lines too
        Assert.Contains($":{run.Port}", logged, StringComparison.Ordinal);
        Assert.Contains("Session", logged, StringComparison.Ordinal);
        Assert.DoesNotContain(token, logged, StringComparison.OrdinalIgnoreCase);
    }
}
