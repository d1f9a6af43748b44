using OpenQA.Selenium;
using OpenQA.Selenium.Chrome;

namespace SortRig.Host.Tests.Web;

/// <summary>
/// Real headless Chromium driven through ChromeDriver, both from the Debian packages chromium and
/// chromium-driver (scripts/test-deps installs them). The paths are explicit so Selenium Manager
/// never tries to download a browser or a driver.
/// </summary>
internal static class HeadlessChromium
{
    public const string Browser = "/usr/bin/chromium";
    public const string DriverDirectory = "/usr/bin";
    public const string DriverFile = "chromedriver";

    /// <summary>Why the browser cannot run here, or null when it can.</summary>
    public static string? Missing()
    {
        var missing = new[] { Browser, Path.Combine(DriverDirectory, DriverFile) }.Where(p => !File.Exists(p)).ToList();
        return missing.Count == 0
            ? null
            : $"needs {string.Join(" and ", missing)} (Debian packages chromium, chromium-driver; bash "
                + $"scripts/test-deps installs them)";
    }

    /// <summary>Starts a browser with a fresh profile at the given window size (CSS pixels).</summary>
    public static ChromeDriver Start(string profileDirectory, int width, int height)
    {
        if (Missing() is { } why)
        {
            throw new InvalidOperationException("headless Chromium " + why);
        }

        var service = ChromeDriverService.CreateDefaultService(DriverDirectory, DriverFile);
        service.SuppressInitialDiagnosticInformation = true;
        service.HideCommandPromptWindow = true;
        var options = new ChromeOptions { BinaryLocation = Browser };
        options.AddArguments(
            "--headless=new",
            "--no-sandbox",
            "--disable-gpu",
            "--disable-dev-shm-usage",
            "--disable-quic",
            "--no-first-run",
            "--disable-background-networking",
            "--disable-component-update",
            "--disable-sync",
            "--hide-scrollbars",
            "--force-device-scale-factor=1",
            $"--window-size={width},{height}",
            $"--user-data-dir={profileDirectory}"
        );
        options.SetLoggingPreference(LogType.Browser, LogLevel.All);
        return new ChromeDriver(service, options, TimeSpan.FromSeconds(30));
    }
}

/// <summary>
/// A fact that needs headless Chromium: skipped with the reason when the browser is missing on a
/// developer's machine, run (and so failing loudly) on CI, where CI=true and it must be installed.
/// </summary>
public sealed class ChromiumFactAttribute : FactAttribute
{
    public ChromiumFactAttribute()
    {
        if (HeadlessChromium.Missing() is { } why && Environment.GetEnvironmentVariable("CI") != "true")
        {
            Skip = "headless Chromium " + why;
        }
    }
}
