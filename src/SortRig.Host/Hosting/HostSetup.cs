using Microsoft.AspNetCore.Builder;
using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Serilog;
using Serilog.Events;
using SortRig.Host.Web;

namespace SortRig.Host.Hosting;

/// <summary>
/// Builds the generic host every long-running verb uses: configuration from appsettings.json,
/// SORTRIG_* environment variables and the verb's flags; Serilog to stderr and a rolling file;
/// systemd integration when run as a unit.
/// </summary>
internal static class HostSetup
{
    /// <summary>Environment variable prefix: SORTRIG_Sort__Nominal=1000 sets Sort:Nominal.</summary>
    public const string EnvironmentPrefix = "SORTRIG_";

    /// <summary>
    /// A web host when the flags enable the page (Web:Enabled), else a generic host; configured
    /// as <see cref="Configure"/> says.
    /// </summary>
    public static IHostApplicationBuilder CreateBuilder(IReadOnlyDictionary<string, string?> flags, bool quietConsole)
    {
        var probe = new ConfigurationBuilder().AddInMemoryCollection(flags).Build();
        IHostApplicationBuilder builder = probe.GetValue<bool>("Web:Enabled")
            ? WebApplication.CreateBuilder(
                new WebApplicationOptions { Args = [], ContentRootPath = Environment.CurrentDirectory }
            )
            : Microsoft.Extensions.Hosting.Host.CreateApplicationBuilder(
                new HostApplicationBuilderSettings { Args = [], ContentRootPath = Environment.CurrentDirectory }
            );
        Configure(builder, flags, quietConsole);
        return builder;
    }

    /// <summary>Builds the host; a web host gets the bench page (which refuses an unsafe bind here).</summary>
    public static IHost Build(IHostApplicationBuilder builder)
    {
        if (builder is WebApplicationBuilder web)
        {
            var webOptions = WebSetup.Configure(web);
            var app = web.Build();
            WebSetup.Use(app, webOptions);
            // Said before the live view takes the screen, so the operator knows where to point a browser.
            Console.Out.WriteLine($"bench page: {string.Join(' ', WebBindGuard.Urls(webOptions))}");
            return app;
        }

        return ((HostApplicationBuilder)builder).Build();
    }

    public static void Configure(
        IHostApplicationBuilder builder,
        IReadOnlyDictionary<string, string?> flags,
        bool quietConsole
    )
    {
        builder.Configuration.AddJsonFile(Path.Combine(AppContext.BaseDirectory, "appsettings.json"), optional: true);
        builder.Configuration.AddJsonFile("appsettings.json", optional: true);
        builder.Configuration.AddEnvironmentVariables(EnvironmentPrefix);
        builder.Configuration.AddInMemoryCollection(flags);

        var logFile = builder.Configuration["Logging:File"] ?? "logs/sortrig-.log";
        builder.Services.AddSerilog(
            (_, logger) =>
                logger
                    .ReadFrom.Configuration(builder.Configuration)
                    .Enrich.FromLogContext()
                    // The console gets one line per event, never a stack trace (those go to the log file only), and not
                    // the failures the verb itself tells the operator in plain words.
                    .WriteTo.Logger(console =>
                        console
                            .Filter.ByExcluding(IsToldByTheVerb)
                            .WriteTo.Console(
                                restrictedToMinimumLevel: quietConsole
                                    ? LogEventLevel.Warning
                                    : LogEventLevel.Information,
                                standardErrorFromLevel: LogEventLevel.Verbose,
                                outputTemplate: "[{Timestamp:HH:mm:ss} {Level:u3}] {Message:lj}{NewLine}",
                                formatProvider: System.Globalization.CultureInfo.InvariantCulture
                            )
                    )
                    .WriteTo.File(
                        logFile,
                        rollingInterval: RollingInterval.Day,
                        retainedFileCountLimit: 14,
                        formatProvider: System.Globalization.CultureInfo.InvariantCulture
                    )
        );
        builder.Services.AddSystemd();
    }

    // Event ids of failures the verbs print themselves: Host 7001 ("sorting stopped: ..."), Engine 6101 (a meter fault
    // of a sort, each told to the operator as "meter: ...; trying again in ..." or "...; reconnecting"). The log file
    // keeps them.
    private static bool IsToldByTheVerb(Serilog.Events.LogEvent e) =>
        e.Properties.TryGetValue("EventId", out var id)
        && id is Serilog.Events.StructureValue s
        && s.Properties.Any(p => p.Name == "Id" && p.Value is Serilog.Events.ScalarValue { Value: 7001 or 6101 });
}
