using System.Net;
using System.Text.RegularExpressions;

namespace SortRig.Host.Tests.Web;

/// <summary>Every asset of the page is served by the host itself; the browser is told to load nothing else.</summary>
public sealed partial class WebPageAssetTests
{
    [Fact]
    public async Task Page_EveryReferencedAssetIsServedLocally_AndNothingPointsOffSite()
    {
        await using var web = await WebHarness.StartAsync();
        var html = await web.Http.GetStringAsync("/");
        var references = Reference().Matches(html).Select(m => m.Groups[1].Value).ToList();

        Assert.Contains("/app.js", references);
        Assert.Contains("/app.css", references);
        foreach (var path in references)
        {
            Assert.StartsWith("/", path, StringComparison.Ordinal);
            Assert.False(path.StartsWith("//", StringComparison.Ordinal), path + " would load from another host");
            using var answer = await web.Http.GetAsync(path);
            Assert.Equal(HttpStatusCode.OK, answer.StatusCode);
            var text = await answer.Content.ReadAsStringAsync();
            Assert.DoesNotMatch(OffSite(), text);
        }

        Assert.DoesNotMatch(OffSite(), html);
    }

    [Fact]
    public async Task Page_CarriesAPolicyThatAllowsOnlyItsOwnOrigin()
    {
        await using var web = await WebHarness.StartAsync();

        using var answer = await web.Http.GetAsync("/");

        var policy = string.Join(";", answer.Headers.GetValues("Content-Security-Policy"));
        Assert.Contains("default-src 'self'", policy, StringComparison.Ordinal);
        Assert.Contains("connect-src 'self'", policy, StringComparison.Ordinal);
        Assert.Equal("no-referrer", Assert.Single(answer.Headers.GetValues("Referrer-Policy")));
        Assert.Equal("text/html", answer.Content.Headers.ContentType?.MediaType);
    }

    [Fact]
    public async Task UnknownFile_IsNotFound()
    {
        await using var web = await WebHarness.StartAsync();

        using var answer = await web.Http.GetAsync("/appsettings.json");

        Assert.Equal(HttpStatusCode.NotFound, answer.StatusCode);
    }

    [GeneratedRegex("(?:src|href)=\"([^\"]+)\"")]
    private static partial Regex Reference();

    // An absolute URL to anywhere (the SVG namespace is a name, not something fetched).
    [GeneratedRegex(@"(?:https?:)?//(?!www\.w3\.org/2000/svg)[a-z0-9.-]+\.[a-z]{2,}", RegexOptions.IgnoreCase)]
    private static partial Regex OffSite();
}
