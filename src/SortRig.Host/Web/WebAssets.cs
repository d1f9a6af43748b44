using System.Reflection;
using Microsoft.AspNetCore.Http;

namespace SortRig.Host.Web;

/// <summary>
/// The page's files, embedded in the assembly (Web/Assets/*): nothing is fetched from elsewhere.
/// Only these names are ever served; a request cannot name any other file.
/// </summary>
internal static class WebAssets
{
    private const string Prefix = "SortRig.Host.Web.Assets.";
    private static readonly Assembly s_assembly = typeof(WebAssets).Assembly;

    /// <summary>File names of the embedded assets, e.g. "index.html", "app.js".</summary>
    public static IReadOnlyList<string> Names { get; } =
    [
        .. s_assembly
            .GetManifestResourceNames()
            .Where(n => n.StartsWith(Prefix, StringComparison.Ordinal))
            .Select(n => n[Prefix.Length..])
            .Order(StringComparer.Ordinal),
    ];

    /// <summary>The content type an asset is served with.</summary>
    public static string ContentType(string name) =>
        Path.GetExtension(name) switch
        {
            ".html" => "text/html; charset=utf-8",
            ".js" => "text/javascript; charset=utf-8",
            ".css" => "text/css; charset=utf-8",
            ".svg" => "image/svg+xml",
            ".png" => "image/png",
            _ => "application/octet-stream",
        };

    public static IResult Serve(string name)
    {
        var stream = s_assembly.GetManifestResourceStream(Prefix + name);
        return stream is null ? Results.NotFound() : Results.Stream(stream, ContentType(name));
    }
}
