using System.Globalization;
using System.Text.Json;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.Hosting;
using SortRig.Engine.Events;

namespace SortRig.Host.Web;

/// <summary>
/// GET /api/events: the bench event stream as server-sent events, one JSON event per message with
/// <c>id: &lt;run&gt;.&lt;sequence&gt;</c>. A reconnecting browser sends Last-Event-ID and gets only
/// what it missed; an id from an earlier run of the host (sequences start again at 1 after a
/// restart) gets the whole kept history.
/// </summary>
internal static class EventStream
{
    /// <summary>Marks this run of the host in event ids.</summary>
    public static readonly string Run = Guid.NewGuid().ToString("N")[..8];

    /// <summary>The last sequence a client saw in this run, from its Last-Event-ID; 0 when none or another
    /// run's.</summary>
    public static long LastSeen(string lastEventId)
    {
        var dot = lastEventId.IndexOf('.', StringComparison.Ordinal);
        var run = dot < 0 ? Run : lastEventId[..dot];
        return
            run == Run
            && long.TryParse(lastEventId[(dot + 1)..], NumberStyles.None, CultureInfo.InvariantCulture, out var seen)
            ? seen
            : 0;
    }

    public static async Task StreamAsync(HttpContext context, BenchEventHub hub, IHostApplicationLifetime lifetime)
    {
        // The stream ends when the browser goes away or the application stops: an open stream must
        // never hold up shutdown.
        using var stop = CancellationTokenSource.CreateLinkedTokenSource(
            context.RequestAborted,
            lifetime.ApplicationStopping
        );
        var ct = stop.Token;
        context.Response.Headers.ContentType = "text/event-stream";
        context.Response.Headers.CacheControl = "no-cache";
        var lastSeen = LastSeen(context.Request.Headers["Last-Event-ID"].ToString());
        try
        {
            // Headers go out at once so the browser reports the stream open before the first event.
            await context.Response.WriteAsync(": sortrig events\n\n", ct).ConfigureAwait(false);
            await context.Response.Body.FlushAsync(ct).ConfigureAwait(false);
            await foreach (var e in hub.SubscribeAsync(includeHistory: true, ct).ConfigureAwait(false))
            {
                if (e.Sequence <= lastSeen)
                {
                    continue;
                }

                var data = JsonSerializer.Serialize(e, WebEndpoints.Json);
                await context
                    .Response.WriteAsync($"id: {Run}.{e.Sequence}\ndata: {data}\n\n", ct)
                    .ConfigureAwait(false);
                await context.Response.Body.FlushAsync(ct).ConfigureAwait(false);
            }
        }
        catch (OperationCanceledException) when (ct.IsCancellationRequested)
        {
            // The browser went away or the application is stopping.
        }
    }
}
