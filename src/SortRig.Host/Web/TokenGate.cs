using System.Security.Cryptography;
using System.Text;
using Microsoft.AspNetCore.Http;

namespace SortRig.Host.Web;

/// <summary>
/// Middleware that refuses every request without the configured token (401). Accepts
/// "Authorization: Bearer &lt;token&gt;", a "token" query parameter (which sets a cookie so the page's
/// own requests and its event stream carry it), or that cookie. Compares in constant time.
/// </summary>
internal sealed class TokenGate(RequestDelegate next, string token)
{
    public const string CookieName = "sortrig_token";
    private readonly byte[] _token = Encoding.UTF8.GetBytes(token);

    public async Task InvokeAsync(HttpContext context)
    {
        var fromQuery = context.Request.Query["token"].ToString();
        var fromHeader = context.Request.Headers.Authorization.ToString();
        var offered = fromHeader.StartsWith("Bearer ", StringComparison.Ordinal) ? fromHeader[7..]
            : fromQuery.Length > 0 ? fromQuery
            : context.Request.Cookies[CookieName] ?? "";
        if (!Matches(offered))
        {
            context.Response.StatusCode = StatusCodes.Status401Unauthorized;
            await context.Response.WriteAsync("token required\n").ConfigureAwait(false);
            return;
        }

        if (fromQuery.Length > 0)
        {
            context.Response.Cookies.Append(CookieName, fromQuery, new CookieOptions { HttpOnly = true, SameSite = SameSiteMode.Strict });
        }

        await next(context).ConfigureAwait(false);
    }

    private bool Matches(string offered) =>
        CryptographicOperations.FixedTimeEquals(Encoding.UTF8.GetBytes(offered), _token);
}
