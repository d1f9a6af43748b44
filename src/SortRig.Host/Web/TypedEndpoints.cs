using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Http;
using Microsoft.AspNetCore.Routing;
using Microsoft.Extensions.DependencyInjection;
using SortRig.Engine.Typed;

namespace SortRig.Host.Web;

/// <summary>
/// The bench page's entry field for a typed meter (TYPED::profile): GET /api/typed gives the prompt, POST /api/typed
/// queues one line as if typed on the console. The line is only ever text for the entry check (a number, a range, or
/// "again"/"finish"); at most 40 characters. The token and same-origin checks of every write apply (docs/web.md).
/// </summary>
internal static class TypedEndpoints
{
    /// <summary>Longest line accepted, in characters.</summary>
    public const int MaxLine = 40;

    public static void Map(RouteGroupBuilder api)
    {
        // Resolved per request: a host without a typed meter (drift, tests' harnesses) has no TypedEntries at all.
        api.MapGet("/typed", (HttpContext http) =>
            http.RequestServices.GetService<TypedEntries>() is { CurrentPrompt.Length: > 0 } entries
                ? Results.Json(new TypedPrompt(true, entries.CurrentPrompt), WebEndpoints.Json)
                : Results.Json(new TypedPrompt(false, ""), WebEndpoints.Json)
        );
        api.MapPost("/typed", async (TypedLine body, HttpContext http, CancellationToken ct) =>
        {
            if (http.RequestServices.GetService<TypedEntries>() is not { CurrentPrompt.Length: > 0 } entries)
            {
                return Results.Json(
                    new { error = "this session has no typed meter" },
                    WebEndpoints.Json,
                    statusCode: StatusCodes.Status404NotFound
                );
            }

            var line = body.Line ?? "";
            if (line.Length > MaxLine || line.Any(char.IsControl))
            {
                return Results.Json(
                    new { error = $"line: at most {MaxLine} printable characters" },
                    WebEndpoints.Json,
                    statusCode: StatusCodes.Status400BadRequest
                );
            }

            await entries.PostAsync(line, ct).ConfigureAwait(false);
            return Results.Json(new { queued = line }, WebEndpoints.Json, statusCode: StatusCodes.Status202Accepted);
        });
    }

    /// <summary>The body of POST /api/typed.</summary>
    internal sealed record TypedLine(string? Line);

    /// <summary>The answer of GET /api/typed.</summary>
    internal sealed record TypedPrompt(bool Active, string Prompt);
}
