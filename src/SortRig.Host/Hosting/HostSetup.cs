using Microsoft.Extensions.Configuration;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.Hosting;
using Serilog;
using Serilog.Events;

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

    public static void Configure(IHostApplicationBuilder builder, IReadOnlyDictionary<string, string?> flags, bool quietConsole)
    {
        builder.Configuration.AddJsonFile(Path.Combine(AppContext.BaseDirectory, "appsettings.json"), optional: true);
        builder.Configuration.AddJsonFile("appsettings.json", optional: true);
        builder.Configuration.AddEnvironmentVariables(EnvironmentPrefix);
        builder.Configuration.AddInMemoryCollection(flags);

        var logFile = builder.Configuration["Logging:File"] ?? "logs/sortrig-.log";
        builder.Services.AddSerilog((_, logger) => logger
            .ReadFrom.Configuration(builder.Configuration)
            .Enrich.FromLogContext()
            .WriteTo.Console(
                restrictedToMinimumLevel: quietConsole ? LogEventLevel.Warning : LogEventLevel.Information,
                standardErrorFromLevel: LogEventLevel.Verbose,
                formatProvider: System.Globalization.CultureInfo.InvariantCulture)
            .WriteTo.File(
                logFile,
                rollingInterval: RollingInterval.Day,
                retainedFileCountLimit: 14,
                formatProvider: System.Globalization.CultureInfo.InvariantCulture));
        builder.Services.AddSystemd();
    }
}
