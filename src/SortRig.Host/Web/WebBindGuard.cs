using System.Net;

namespace SortRig.Host.Web;

/// <summary>Refuses to start the page on a non-loopback address without a token.</summary>
public static class WebBindGuard
{
    /// <summary>Throws <see cref="InvalidOperationException"/> naming the URL when the binding is unsafe.</summary>
    public static void Check(WebOptions options)
    {
        foreach (var url in options.Urls.Split(';', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries))
        {
            if (!IsLoopback(url) && string.IsNullOrEmpty(options.Token))
            {
                throw new InvalidOperationException(
                    $"Web:Urls '{url}' binds an address other than loopback; set Web:Token (or SORTRIG_Web__Token) to allow it.");
            }
        }
    }

    /// <summary>True when the URL's host is a loopback name or address.</summary>
    public static bool IsLoopback(string url)
    {
        if (!Uri.TryCreate(url.Replace("://*", "://0.0.0.0", StringComparison.Ordinal).Replace("://+", "://0.0.0.0", StringComparison.Ordinal), UriKind.Absolute, out var uri))
        {
            throw new InvalidOperationException($"Web:Urls '{url}' is not a URL (expected e.g. http://127.0.0.1:5080).");
        }

        return uri.IsLoopback || (IPAddress.TryParse(uri.Host.Trim('[', ']'), out var ip) && IPAddress.IsLoopback(ip));
    }
}
