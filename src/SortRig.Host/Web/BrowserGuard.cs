using System.Net;
using Microsoft.AspNetCore.Http;

namespace SortRig.Host.Web;

/// <summary>
/// Middleware that keeps other web sites out of the bench page. Every answer carries a content
/// security policy allowing only this origin (no script, style or connection to any other host),
/// and no Referer leaves the page. A state-changing request whose Origin is another site is refused
/// (403), so a page open in another tab cannot press the operator's buttons. When the page listens
/// on loopback only, a Host header that is not a loopback name is refused too (DNS rebinding).
/// </summary>
internal sealed class BrowserGuard(RequestDelegate next, bool loopbackOnly)
{
    private const string Policy =
        "default-src 'self'; script-src 'self'; style-src 'self'; img-src 'self' data:; connect-src 'self'; "
        + "object-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

    public async Task InvokeAsync(HttpContext context)
    {
        var headers = context.Response.Headers;
        headers.ContentSecurityPolicy = Policy;
        headers.XContentTypeOptions = "nosniff";
        headers.XFrameOptions = "DENY";
        headers["Referrer-Policy"] = "no-referrer";

        var request = context.Request;
        if (loopbackOnly && !IsLoopbackHost(request.Host.Host))
        {
            await RefuseAsync(context, "this page answers to a loopback host name only\n").ConfigureAwait(false);
            return;
        }

        if (!HttpMethods.IsGet(request.Method) && !HttpMethods.IsHead(request.Method) && !SameOrigin(request))
        {
            await RefuseAsync(context, "cross-site request refused\n").ConfigureAwait(false);
            return;
        }

        await next(context).ConfigureAwait(false);
    }

    /// <summary>True for localhost and loopback addresses (the Host header's host part).</summary>
    public static bool IsLoopbackHost(string host) =>
        string.Equals(host, "localhost", StringComparison.OrdinalIgnoreCase)
        || (IPAddress.TryParse(host.Trim('[', ']'), out var ip) && IPAddress.IsLoopback(ip));

    // A request without Origin (curl, scripts) is not a browser acting for another site.
    private static bool SameOrigin(HttpRequest request)
    {
        var origin = request.Headers.Origin.ToString();
        return origin.Length == 0
            || (
                Uri.TryCreate(origin, UriKind.Absolute, out var uri)
                && string.Equals(
                    uri.GetLeftPart(UriPartial.Authority),
                    $"{request.Scheme}://{request.Host}",
                    StringComparison.OrdinalIgnoreCase
                )
            );
    }

    private static Task RefuseAsync(HttpContext context, string why)
    {
        context.Response.StatusCode = StatusCodes.Status403Forbidden;
        return context.Response.WriteAsync(why);
    }
}
