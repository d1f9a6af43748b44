using System.Globalization;
using System.Text.Json;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.Hosting;
using SortRig.Host.Events;

namespace SortRig.Host.Web;

/// <summary>
/// GET /api/events: the bench event stream as server-sent events, one JSON event per message with
/// <c>id:</c> = sequence. A reconnecting browser sends Last-Event-ID and gets only what it missed.
/// </summary>
internal static class EventStream
{
    public static async Task StreamAsync(HttpContext context, BenchEventHub hub, IHostApplicationLifetime lifetime)
    {
        // The stream ends when the browser goes away or the application stops: an open stream must
        // never hold up shutdown.
        using var stop = CancellationTokenSource.CreateLinkedTokenSource(context.RequestAborted, lifetime.ApplicationStopping);
        var ct = stop.Token;
        context.Response.Headers.ContentType = "text/event-stream";
        context.Response.Headers.CacheControl = "no-cache";
        long.TryParse(context.Request.Headers["Last-Event-ID"].ToString(), NumberStyles.Integer, CultureInfo.InvariantCulture, out var lastSeen);
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
                await context.Response.WriteAsync($"id: {e.Sequence}\ndata: {data}\n\n", ct).ConfigureAwait(false);
                await context.Response.Body.FlushAsync(ct).ConfigureAwait(false);
            }
        }
        catch (OperationCanceledException) when (ct.IsCancellationRequested)
        {
            // The browser went away or the application is stopping.
        }
    }
}
