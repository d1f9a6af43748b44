using System.Globalization;
using System.Text.Json;
using System.Text.RegularExpressions;
using OpenQA.Selenium;
using OpenQA.Selenium.Chrome;
using OpenQA.Selenium.Interactions;
using SortRig.Storage.Contracts;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Web;

/// <summary>
/// The bench page end to end in real headless Chromium: a simulated sort of six parts with the
/// page open, an undo pressed on the page, the precision log as the outside record to check
/// the page against, and screenshots kept as test artifacts.
/// </summary>
[Collection(WebSortCollection.Name)]
public sealed class BenchPageBrowserTests(ITestOutputHelper output)
{
    [ChromiumFact]
    public async Task SortWithPageOpen_AnnouncesInOrder_AndAnUndoOnThePageReachesThePrecisionLog()
    {
        // The browser first (its start-up is the slow part), then the sort at speed 6: a part takes
        // about a second of wall time, so the page sees each one arrive.
        var profile = Directory.CreateTempSubdirectory("sortrig-chromium-").FullName;
        using var browser = HeadlessChromium.Start(profile, 1920, 1080);
        await using var run = await WebSortRun.StartAsync(parts: 6, speed: 6);
        browser.Navigate().GoToUrl(run.BaseUrl + "/");

        var early = await PageProbe.PollAsync(
            () => PageProbe.ReadLog(browser),
            l => l.Count >= 3,
            TimeSpan.FromSeconds(40),
            "three announcements on the page"
        );
        browser.FindElement(By.Id("undo")).Click();
        var undoNotice = await PageProbe.PollAsync(
            () => browser.FindElement(By.Id("notices")).Text,
            t => t.Contains("undone", StringComparison.Ordinal),
            TimeSpan.FromSeconds(15),
            "the undo notice on the page"
        );
        var undonePart = int.Parse(
            Regex.Match(undoNotice, @"part (\d+) undone").Groups[1].Value,
            CultureInfo.InvariantCulture
        );
        await PageProbe.PollAsync(
            () => PageProbe.ReadLog(browser),
            l => l.Any(i => i.Part == undonePart && i.Stored == nameof(PartState.Undone)),
            TimeSpan.FromSeconds(5),
            $"part {undonePart} shown as undone"
        );
        PageProbe.Save(browser, "bench-page.png", output);

        // The single keys: P pauses (the session says so), P again carries on.
        new Actions(browser).SendKeys("p").Perform();
        await PageProbe.PollAsync(
            () => browser.FindElement(By.Id("progress")).Text,
            t => t.Contains("PAUSED", StringComparison.Ordinal),
            TimeSpan.FromSeconds(10),
            "paused"
        );
        new Actions(browser).SendKeys("p").Perform();
        await PageProbe.PollAsync(
            () => browser.FindElement(By.Id("progress")).Text,
            t => !t.Contains("PAUSED", StringComparison.Ordinal),
            TimeSpan.FromSeconds(10),
            "carrying on"
        );

        await PageProbe.PollAsync(
            () => browser.FindElement(By.Id("link")).Text,
            t => t == "finished",
            TimeSpan.FromSeconds(60),
            "the finished session"
        );
        var final = await PageProbe.PollAsync(
            () => PageProbe.ReadLog(browser),
            l => l.Any(i => i.Stored == nameof(PartState.Undone)) && l.All(i => i.Stored is not null),
            TimeSpan.FromSeconds(10),
            "stored states on every logged part"
        );
        Assert.True(
            browser.FindElement(By.Id("summary")).Displayed,
            "the session summary shows once the session is finished"
        );
        PageProbe.Save(browser, "bench-summary.png", output);
        var tiles = browser
            .FindElements(By.CssSelector("#counts .count"))
            .Select(t =>
                (
                    Cup: t.GetAttribute("data-cup"),
                    Count: int.Parse(t.FindElement(By.TagName("span")).Text, CultureInfo.InvariantCulture)
                )
            )
            .ToList();
        var errors = browser
            .Manage()
            .Logs.GetLog(LogType.Browser)
            .Where(e => e.Level >= LogLevel.Severe)
            .Select(e => e.Message)
            .ToList();
        using var http = new HttpClient();
        var sessionId = JsonDocument
            .Parse(await http.GetStringAsync(run.BaseUrl + "/api/session"))
            .RootElement.GetProperty("sessionId")
            .GetInt64();
        browser.Quit();
        await run.StopAsync();
        Directory.Delete(profile, recursive: true);

        Assert.Empty(errors); // no script error and no refused (off-origin) resource on the page
        var stored = await run.StoredPartsAsync(sessionId);
        output.WriteLine(
            "page: " + string.Join(" ", final.Select(i => $"{i.Part}:{i.Cup}{(i.Seeded ? "(at load)" : "")}"))
        );
        output.WriteLine("log:  " + string.Join(" ", stored.Select(p => $"{p.Number}:{p.CupLabel}:{p.State}")));

        // Most announcements must have come over the live stream, not from the state at load.
        Assert.True(final.Count(i => !i.Seeded) >= 3, "at least three announcements arrived while the page was open");
        Assert.True(early.Count >= 3);

        // Every part in the log appears on the page once, in ascending order, in the cup the log stores.
        Assert.Equal(stored.Select(p => p.Number), final.Select(i => i.Part));
        Assert.Equal(stored.Select(p => p.CupLabel ?? ""), final.Select(i => i.Cup));
        Assert.Equal(stored.Select(p => p.State.ToString()), final.Select(i => i.Stored));

        // Cup tiles stand where the cups stand: every cup from A up to the highest used (empty ones show 0,
        // the undone part's cup keeps its tile), the reject cup last; each count as the log has it.
        const string letters = "ABCDEFGHJKLMNPQSTUVWXYZ";
        var used = stored.Select(p => p.CupLabel).OfType<string>().ToList();
        var top = used.Where(c => c != "R").Max(c => letters.IndexOf(c, StringComparison.Ordinal));
        // the cup counts always carry the reject cup
        string[] expectedOrder = [.. letters[..(top + 1)].Select(c => c.ToString()), "R"];
        Assert.Equal(expectedOrder, tiles.Select(t => t.Cup));
        Assert.All(tiles, t =>
            Assert.Equal(
                stored.Count(p => p.CupLabel == t.Cup && p.State is PartState.Accepted or PartState.Announced),
                t.Count
            )
        );

        // Exactly one part is undone in the log: the one the page's notice named.
        var undone = Assert.Single(stored, p => p.State == PartState.Undone);
        Assert.Equal(undone.Number, undonePart);
    }
}
