using System.Net;

namespace SortRig.Host.Web;

/// <summary>Refuses to start the page on a non-loopback address without a token, or with a weak one.</summary>
internal static class WebBindGuard
{
    /// <summary>Shortest token accepted, in characters (e.g. 16 random hex digits = 64 bits).</summary>
    public const int MinimumTokenLength = 16;

    /// <summary>
    /// Throws <see cref="InvalidOperationException"/> naming the URL when the binding is unsafe, or
    /// naming Web:Token when a token is set but shorter than <see cref="MinimumTokenLength"/>.
    /// The token itself never appears in a message.
    /// </summary>
    public static void Check(WebOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        if (options.Token.Length > 0 && options.Token.Trim().Length < MinimumTokenLength)
        {
            throw new InvalidOperationException(
                $"Web:Token is too short: use at least {MinimumTokenLength} characters (e.g. the output of `openssl "
                    + $"rand -hex 16`)."
            );
        }

        foreach (var url in Urls(options))
        {
            if (!IsLoopback(url) && options.Token.Length == 0)
            {
                throw new InvalidOperationException(
                    $"Web:Urls '{url}' binds an address other than loopback; set Web:Token (or SORTRIG_Web__Token) "
                        + $"to allow it."
                );
            }
        }
    }

    /// <summary>The URLs of <see cref="WebOptions.Urls"/>, split on ';'.</summary>
    public static IReadOnlyList<string> Urls(WebOptions options)
    {
        ArgumentNullException.ThrowIfNull(options);
        return options.Urls.Split(';', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries);
    }

    /// <summary>True when the URL's host is a loopback name or address.</summary>
    public static bool IsLoopback(string url)
    {
        ArgumentNullException.ThrowIfNull(url);
        if (
            !Uri.TryCreate(
                url.Replace("://*", "://0.0.0.0", StringComparison.Ordinal)
                    .Replace("://+", "://0.0.0.0", StringComparison.Ordinal),
                UriKind.Absolute,
                out var uri
            )
        )
        {
            throw new InvalidOperationException(
                $"Web:Urls '{url}' is not a URL (expected e.g. http://127.0.0.1:5080)."
            );
        }

        return uri.IsLoopback || (IPAddress.TryParse(uri.Host.Trim('[', ']'), out var ip) && IPAddress.IsLoopback(ip));
    }
}
