using Microsoft.Extensions.Time.Testing;
using OpenQA.Selenium;
using SortRig.Engine.Events;
using Xunit.Abstractions;

namespace SortRig.Host.Tests.Web;

/// <summary>The drift view in real headless Chromium, fed Drift events on the page's event stream.</summary>
[Collection(WebSortCollection.Name)]
public sealed class DriftPageBrowserTests(ITestOutputHelper output)
{
    [ChromiumFact]
    public async Task DriftEvents_ShowTheLatestSamplePerChannel_AndTheChangeSinceTheFirst()
    {
        // Two channels logged once a minute for 30 minutes: a 10 kΩ part rising 0.5 ppm/min and a
        // 1 kΩ part falling 0.2 ppm/min (invented demo figures). After 29 steps: +14.5 and −5.8 ppm.
        var time = new FakeTimeProvider(new DateTimeOffset(2026, 3, 2, 22, 0, 0, TimeSpan.Zero));
        await using var web = await WebHarness.StartAsync(time: time);
        for (var minute = 0; minute < 30; minute++)
        {
            web.Hub.Publish(
                new BenchEvent(
                    0,
                    BenchEventKind.Drift,
                    default,
                    PartNumber: 1,
                    Value: 10_000 * (1 + (0.5e-6 * minute)),
                    State: "Sample",
                    Text: "R2R MSB 10k"
                )
            );
            web.Hub.Publish(
                new BenchEvent(
                    0,
                    BenchEventKind.Drift,
                    default,
                    PartNumber: 2,
                    Value: 1_000 * (1 - (0.2e-6 * minute)),
                    State: "Sample",
                    Text: "divider 1k"
                )
            );
            time.Advance(TimeSpan.FromMinutes(1));
        }

        var profile = Directory.CreateTempSubdirectory("sortrig-chromium-").FullName;
        try
        {
            using var browser = HeadlessChromium.Start(profile, 1920, 1080);
            browser.Navigate().GoToUrl(web.BaseUrl + "/");
            var rows = await PageProbe.PollAsync(
                () => browser.FindElements(By.CssSelector("#drifttable tr")).Select(r => r.Text).ToList(),
                r => r.Count == 2,
                TimeSpan.FromSeconds(15),
                "two drift channels"
            );

            Assert.True(browser.FindElement(By.Id("drift")).Displayed);
            Assert.False(
                browser.FindElement(By.Id("cupbox")).Displayed,
                "with no sorting session the page shows the drift view only"
            );
            Assert.Contains("ch 1", rows[0], StringComparison.Ordinal);
            Assert.Contains("+14.5 ppm since start", rows[0], StringComparison.Ordinal);
            Assert.Contains("R2R MSB 10k", rows[0], StringComparison.Ordinal);
            Assert.Contains("ch 2", rows[1], StringComparison.Ordinal);
            Assert.Contains("\u22125.8 ppm since start", rows[1], StringComparison.Ordinal);
            var inked = (long)
                browser.ExecuteScript(
                    "const c = document.getElementById('driftplot'); const d = c.getContext('2d').getImageData(0, 0, "
                        + "c.width, c.height).data;"
                        + " let n = 0; for (let i = 3; i < d.length; i += 4) if (d[i] > 0) n++; return n;"
                )!;
            Assert.True(inked > 1000, $"the drift plot has {inked} drawn pixels");
            PageProbe.Save(browser, "bench-drift.png", output);
            browser.Quit();
        }
        finally
        {
            Directory.Delete(profile, recursive: true);
        }
    }
}
