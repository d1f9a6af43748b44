using System.Reflection;
using Microsoft.AspNetCore.Http;

namespace SortRig.Host.Web;

/// <summary>The page's files, embedded in the assembly: nothing is fetched from elsewhere.</summary>
internal static class WebAssets
{
    private static readonly Assembly s_assembly = typeof(WebAssets).Assembly;

    public static IResult Serve(string name, string contentType)
    {
        var stream = s_assembly.GetManifestResourceStream("SortRig.Host.Web.Assets." + name);
        return stream is null ? Results.NotFound() : Results.Stream(stream, contentType);
    }
}
