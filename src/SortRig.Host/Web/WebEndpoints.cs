using System.Globalization;
using System.Text.Json;
using System.Text.Json.Serialization;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using SortRig.Host.Events;
using SortRig.Host.Operator;
using SortRig.Host.Sorting;

namespace SortRig.Host.Web;

/// <summary>The page and its JSON API (documented in docs/web.md).</summary>
internal static class WebEndpoints
{
    public static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web)
    {
        Converters = { new JsonStringEnumConverter() },
        NumberHandling = JsonNumberHandling.AllowNamedFloatingPointLiterals,
    };

    public static void Map(IEndpointRouteBuilder app)
    {
        app.MapGet("/", () => WebAssets.Serve("index.html", "text/html; charset=utf-8"));
        app.MapGet("/app.js", () => WebAssets.Serve("app.js", "text/javascript; charset=utf-8"));
        app.MapGet("/app.css", () => WebAssets.Serve("app.css", "text/css; charset=utf-8"));

        var api = app.MapGroup("/api");
        api.MapGet("/session", (BenchSnapshot s) => s.Session is { } v ? Results.Json(v, Json) : Results.NotFound());
        api.MapGet("/parts", (BenchSnapshot s) => Results.Json(s.Parts(), Json));
        api.MapGet("/cups", (BenchSnapshot s) => Results.Json(s.Counts, Json));
        api.MapGet("/events/recent", (BenchEventHub hub) => Results.Json(hub.History(), Json));
        api.MapGet("/events", StreamEventsAsync);
        api.MapPost("/actions/{action}", (string action, OperatorCommands commands) =>
        {
            OperatorCommand? command = action switch
            {
                "undo" => OperatorCommand.UndoLast,
                "remeasure" => OperatorCommand.Remeasure,
                "pause" => OperatorCommand.TogglePause,
                "finish" => OperatorCommand.Finish,
                _ => null,
            };
            if (command is null)
            {
                return Results.BadRequest(new { error = $"unknown action '{action}'; expected undo, remeasure, pause or finish" });
            }

            commands.Post(command.Value);
            return Results.Accepted();
        });
    }

    // Server-sent events; a reconnecting browser sends Last-Event-ID and gets only what it missed.
    private static async Task StreamEventsAsync(HttpContext context, BenchEventHub hub)
    {
        var ct = context.RequestAborted;
        context.Response.Headers.ContentType = "text/event-stream";
        context.Response.Headers.CacheControl = "no-cache";
        long.TryParse(context.Request.Headers["Last-Event-ID"].ToString(), NumberStyles.Integer, CultureInfo.InvariantCulture, out var lastSeen);
        try
        {
            await foreach (var e in hub.SubscribeAsync(includeHistory: true, ct).ConfigureAwait(false))
            {
                if (e.Sequence <= lastSeen)
                {
                    continue;
                }

                var data = JsonSerializer.Serialize(e, Json);
                await context.Response.WriteAsync($"id: {e.Sequence}\ndata: {data}\n\n", ct).ConfigureAwait(false);
                await context.Response.Body.FlushAsync(ct).ConfigureAwait(false);
            }
        }
        catch (OperationCanceledException) when (ct.IsCancellationRequested)
        {
            // The browser went away.
        }
    }
}
