using SortRig.Host.Web;

namespace SortRig.Host.Tests.Web;

public sealed class WebBindGuardTests
{
    [Theory]
    [InlineData("http://127.0.0.1:5080")]
    [InlineData("http://localhost:5080")]
    [InlineData("http://[::1]:5080")]
    public void Check_Loopback_NeedsNoToken(string url) => WebBindGuard.Check(new WebOptions { Urls = url });

    [Theory]
    [InlineData("http://0.0.0.0:5080")]
    [InlineData("http://*:5080")]
    [InlineData("http://192.0.2.7:5080")]
    public void Check_NonLoopbackWithoutToken_RefusesNamingTheUrl(string url)
    {
        var e = Assert.Throws<InvalidOperationException>(() => WebBindGuard.Check(new WebOptions { Urls = url }));
        Assert.Contains(url, e.Message, StringComparison.Ordinal);
        Assert.Contains("Web:Token", e.Message, StringComparison.Ordinal);
    }

    [Fact]
    public void Check_NonLoopbackWithToken_IsAllowed() =>
        WebBindGuard.Check(new WebOptions { Urls = "http://0.0.0.0:5080", Token = "b1e5c0de-7a11-4c3e" });

    [Theory]
    [InlineData("short-token")]
    [InlineData("                    ")]
    public void Check_WeakToken_RefusedWithoutRepeatingIt(string token)
    {
        var e = Assert.Throws<InvalidOperationException>(() =>
            WebBindGuard.Check(new WebOptions { Urls = "http://0.0.0.0:5080", Token = token })
        );
        Assert.Contains("Web:Token", e.Message, StringComparison.Ordinal);
        Assert.Contains(
            WebBindGuard.MinimumTokenLength.ToString(System.Globalization.CultureInfo.InvariantCulture),
            e.Message,
            StringComparison.Ordinal
        );
        if (token.Trim().Length > 0)
        {
            Assert.DoesNotContain(token, e.Message, StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Check_SecondUrlNonLoopback_IsRefusedByName()
    {
        var e = Assert.Throws<InvalidOperationException>(() =>
            WebBindGuard.Check(new WebOptions { Urls = "http://127.0.0.1:5080; http://[::]:5081" })
        );
        Assert.Contains("http://[::]:5081", e.Message, StringComparison.Ordinal);
    }
}
