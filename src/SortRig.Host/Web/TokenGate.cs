using System.Security.Cryptography;
using System.Text;
using Microsoft.AspNetCore.Http;

namespace SortRig.Host.Web;

/// <summary>
/// Middleware that refuses every request without the configured token (401). Accepts
/// "Authorization: Bearer &lt;token&gt;", a "token" query parameter, or the cookie that a query
/// token sets (so the page's own requests and its event stream carry it). The page URL with
/// ?token= is answered with a redirect to the bare URL, so the token does not stay in the
/// address bar or the history. Compares in constant time; never writes the token anywhere else.
/// </summary>
internal sealed class TokenGate(RequestDelegate next, string token)
{
    public const string CookieName = "sortrig_token";
    private readonly byte[] _token = Encoding.UTF8.GetBytes(token);

    public async Task InvokeAsync(HttpContext context)
    {
        var request = context.Request;
        var fromQuery = request.Query["token"].ToString();
        var fromHeader = request.Headers.Authorization.ToString();
        var offered =
            fromHeader.StartsWith("Bearer ", StringComparison.Ordinal) ? fromHeader[7..].Trim()
            : fromQuery.Length > 0 ? fromQuery
            : request.Cookies[CookieName] ?? "";
        if (!Matches(offered))
        {
            context.Response.StatusCode = StatusCodes.Status401Unauthorized;
            context.Response.Headers.WWWAuthenticate = "Bearer";
            await context.Response.WriteAsync("token required\n").ConfigureAwait(false);
            return;
        }

        if (fromQuery.Length > 0 && offered == fromQuery)
        {
            context.Response.Cookies.Append(
                CookieName,
                fromQuery,
                new CookieOptions
                {
                    HttpOnly = true,
                    SameSite = SameSiteMode.Strict,
                    Path = "/",
                    Secure = request.IsHttps,
                }
            );
            if (HttpMethods.IsGet(request.Method) && request.Path == "/")
            {
                context.Response.Redirect("/");
                return;
            }
        }

        await next(context).ConfigureAwait(false);
    }

    private bool Matches(string offered) =>
        CryptographicOperations.FixedTimeEquals(Encoding.UTF8.GetBytes(offered), _token);
}
