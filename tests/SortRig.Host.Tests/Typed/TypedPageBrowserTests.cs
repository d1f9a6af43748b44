using OpenQA.Selenium;
using OpenQA.Selenium.Chrome;
using SortRig.Host.Tests.Web;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Typed;

/// <summary>
/// The bench page's entry field for a meter with no link, in real headless Chromium: the sort verb in-process with
/// TYPED::handheld-typed and the page on; the range confirmed, a typo refused and two agreeing values typed on the
/// page; the cup the page shows is the one the precision log stores; the page's undo button undoes it.
/// </summary>
[Collection(WebSortCollection.Name)]
public sealed class TypedPageBrowserTests(ITestOutputHelper output)
{
    private static readonly TimeSpan s_wait = TimeSpan.FromSeconds(30);

    [ChromiumFact]
    public async Task TypedSession_TypeAValueOnThePage_SeeTheCup()
    {
        var profile = Directory.CreateTempSubdirectory("sortrig-chromium-").FullName;
        using var browser = HeadlessChromium.Start(profile, 1280, 900);
        await using var run = await WebSortRun.StartAsync(
            parts: 2,
            speed: 1,
            extra: new Dictionary<string, string?> { ["Sort:Resource"] = "TYPED::handheld-typed", ["Sort:Gap"] = "0.2" }
        );
        browser.Navigate().GoToUrl(run.BaseUrl + "/");

        await PromptAsync(browser, "range set on the meter: press Enter for 50 kOhm");
        Type(browser, "");
        await PromptAsync(browser, "part 1: type the display (kOhm on the 50 kOhm range)");
        Type(browser, "10..003");
        await PromptAsync(browser, "'10..003' has two decimal points");
        Type(browser, "10.003");
        await PromptAsync(browser, "part 1: got 10.003 kOhm (1 of 2)");
        await Task.Delay(300); // the least gap between counted entries is 0.2 s here
        Type(browser, "10k003"); // trade notation (IEC 60062 RKM code) for the same display

        var cup = await PageProbe.PollAsync(
            () => browser.FindElement(By.Id("cup")).Text,
            t => t is { Length: > 0 } && t != "–",
            s_wait,
            "the cup of part 1"
        );
        await PromptAsync(browser, "part 2: type the display");
        PageProbe.Save(browser, "typed-page.png", output);
        var log = PageProbe.ReadLog(browser);

        // The page's undo button reaches the typed loop too: part 1 came out of its cup.
        browser.FindElement(By.Id("undo")).Click();
        await PageProbe.PollAsync(
            () => browser.FindElement(By.Id("notices")).Text,
            t => t.Contains("part 1 undone: take it out of " + cup, StringComparison.Ordinal),
            s_wait,
            "the undo notice"
        );
        var errors = browser
            .Manage()
            .Logs.GetLog(LogType.Browser)
            .Where(e => e.Level >= LogLevel.Severe)
            .Select(e => e.Message)
            .ToList();
        using var http = new HttpClient();
        var session = System
            .Text.Json.JsonDocument.Parse(await http.GetStringAsync(run.BaseUrl + "/api/session"))
            .RootElement.GetProperty("sessionId")
            .GetInt64();
        browser.Quit();
        await run.StopAsync();
        Directory.Delete(profile, recursive: true);

        Assert.Empty(errors);
        var stored = Assert.Single(await run.StoredPartsAsync(session));
        Assert.Equal(10_003, stored.Value, 9);
        Assert.Equal(SortRig.Storage.Contracts.PartState.Undone, stored.State);
        Assert.Equal(stored.CupLabel, cup);
        Assert.Equal(1, Assert.Single(log).Part);
    }

    private static Task<string> PromptAsync(ChromeDriver browser, string start) =>
        PageProbe.PollAsync(
            () => browser.FindElement(By.Id("typedprompt")).Text,
            t => t.StartsWith(start, StringComparison.Ordinal),
            s_wait,
            "prompt: " + start
        );

    private static void Type(ChromeDriver browser, string text)
    {
        var entry = browser.FindElement(By.Id("entry"));
        entry.Clear();
        entry.SendKeys(text + Keys.Enter);
    }
}
