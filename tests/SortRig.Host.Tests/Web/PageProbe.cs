using System.Text.Json;
using OpenQA.Selenium.Chrome;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Web;

/// <summary>Reads the bench page in the browser, waits on it and keeps screenshots as test artifacts.</summary>
internal static class PageProbe
{
    /// <summary>Screenshots go to artifacts/ under the test output folder.</summary>
    public static readonly string Artifacts = Path.Combine(AppContext.BaseDirectory, "artifacts");

    /// <summary>One item of the page's hidden announcement log (#log li).</summary>
    public sealed record LogItem(int Part, string Cup, string State, string? Stored, bool Seeded);

    public static List<LogItem> ReadLog(ChromeDriver browser)
    {
        const string script =
            "return JSON.stringify([...document.querySelectorAll('#log li')].map(li => ({ part: "
            + "Number(li.dataset.part), "
            + "cup: li.dataset.cup, state: li.dataset.state, stored: li.dataset.stored ?? null, seeded: "
            + "li.dataset.seeded === 'true' })));";
        var json = (string)browser.ExecuteScript(script)!;
        return JsonSerializer.Deserialize<List<LogItem>>(json, JsonSerializerOptions.Web)!;
    }

    public static void Save(ChromeDriver browser, string name, ITestOutputHelper output)
    {
        Directory.CreateDirectory(Artifacts);
        var path = Path.Combine(Artifacts, name);
        browser.GetScreenshot().SaveAsFile(path);
        output.WriteLine("screenshot: " + path);
    }

    public static async Task<T> PollAsync<T>(Func<T> read, Func<T, bool> done, TimeSpan timeout, string what)
    {
        var deadline = DateTimeOffset.UtcNow + timeout;
        while (true)
        {
            var value = read();
            if (done(value))
            {
                return value;
            }

            Assert.True(
                DateTimeOffset.UtcNow < deadline,
                $"waited {timeout.TotalSeconds:0} s for {what}; last seen: {JsonSerializer.Serialize(value)}"
            );
            await Task.Delay(100);
        }
    }
}
