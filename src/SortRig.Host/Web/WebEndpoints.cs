using System.Text.Json;
using System.Text.Json.Serialization;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using SortRig.Engine.Events;
using SortRig.Engine.Operator;
using SortRig.Engine.Sorting;
using SortRig.Host.Operator;

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
        app.MapGet("/", () => WebAssets.Serve("index.html"));
        foreach (var name in WebAssets.Names.Where(n => n != "index.html"))
        {
            app.MapGet("/" + name, () => WebAssets.Serve(name));
        }

        var api = app.MapGroup("/api");
        api.MapGet("/session", (BenchSnapshot s) =>
            s.Session is { } v
                ? Results.Json(v, Json)
                : Results.Json(new { error = "no session is open yet" }, Json, statusCode: 404)
        );
        api.MapGet("/parts", (BenchSnapshot s) => Results.Json(s.Parts(), Json));
        api.MapGet("/cups", (BenchSnapshot s) => Results.Json(s.Counts, Json));
        api.MapGet("/check", (BenchSnapshot s) =>
            s.LastCheck is { } c
                ? Results.Json(c, Json)
                : Results.Json(new { error = "no check read yet" }, Json, statusCode: 404)
        );
        api.MapGet("/events/recent", (BenchEventHub hub) => Results.Json(hub.History(), Json));
        api.MapGet("/events", EventStream.StreamAsync);
        TypedEndpoints.Map(api);

        // The only write: one of four fixed actions, queued for the sorting loop. Nothing from the
        // request is passed on: the route value selects an enum member or the request is refused.
        api.MapPost("/actions/{action}", (string action, OperatorCommands commands) =>
        {
            if (OperatorActions.Parse(action) is not { } command)
            {
                return Results.Json(
                    new { error = "unknown action; expected one of " + string.Join(", ", OperatorActions.Names) },
                    Json,
                    statusCode: StatusCodes.Status400BadRequest
                );
            }

            commands.Post(command);
            return Results.Json(
                new { action, queued = command.ToString() },
                Json,
                statusCode: StatusCodes.Status202Accepted
            );
        });
    }
}
